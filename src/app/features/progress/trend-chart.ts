import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { LineChartModule, ScaleType, type Color } from '@swimlane/ngx-charts';
import { NumbersToggle } from './numbers-toggle';
import { PrintMode } from './print-mode';
import { dayMonth, formatRate, rateSentence, shortDate, snapsText } from './rate-text';
import { SessionTable } from './session-table';
import { ROLLING_SERIES, SESSION_SERIES, trendSeries, type TrendPoint } from './trend-series';

let nextId = 0;

const SCHEME: Color = { name: 'trenchwork-trend', selectable: false, group: ScaleType.Ordinal, domain: ['#2E6B4F', '#1F2A36'] };

/** One trend: session rates with their intervals, the rolling rate and the winning-grade line; numbers a click away. */
@Component({
  selector: 'tw-trend-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [LineChartModule, NumbersToggle, SessionTable],
  templateUrl: './trend-chart.html',
  styleUrl: './trend-chart.scss',
})
export class TrendChart {
  readonly heading = input.required<string>();
  readonly points = input.required<readonly TrendPoint[]>();
  readonly total = input.required<{ snaps: number; rate: number | null; interval: [number, number] | null }>();
  readonly threshold = input.required<number>();

  private readonly printMode = inject(PrintMode);
  protected readonly id = `tw-trend-${nextId++}`;
  protected readonly showNumbers = signal(false);
  protected readonly scheme = SCHEME;
  protected readonly sessionSeries = SESSION_SERIES;
  protected readonly rollingSeries = ROLLING_SERIES;
  protected readonly rate = formatRate;
  protected readonly snaps = snapsText;

  protected readonly series = computed(() => trendSeries(this.points()));
  protected readonly hasPoints = computed(() => this.series()[0].series.length > 0);
  protected readonly summary = computed(() => rateSentence(this.total()));
  protected readonly referenceLines = computed(() => [{ name: `Winning grade ${formatRate(this.threshold())}`, value: this.threshold() }]);
  /** On paper a fixed width that fits a portrait page; on screen the box decides. */
  protected readonly view = computed<[number, number] | undefined>(() => (this.printMode.printing() ? [640, 220] : undefined));

  protected readonly percentTick = (v: number) => `${Math.round(v * 100)} %`;
  protected readonly dateTick = dayMonth;
  protected readonly tooltipDate = (d: Date) => shortDate(d.toISOString());
}
