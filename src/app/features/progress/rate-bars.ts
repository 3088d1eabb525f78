import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { BarChartModule, ScaleType, type Color } from '@swimlane/ngx-charts';
import { PrintMode } from './print-mode';
import { formatRate } from './rate-text';

const SCHEME: Color = { name: 'trenchwork-bars', selectable: false, group: ScaleType.Ordinal, domain: ['#2E6B4F'] };
const ROW = 30;

/**
 * Plus rates as horizontal bars on a fixed 0–100 % axis, optionally with the winning-grade line.
 * Horizontal so long names ("Week 4 vs Stonebridge · 64 snaps") stay whole on screen and on paper.
 */
@Component({
  selector: 'tw-rate-bars',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [BarChartModule],
  template: `
    <div class="chart" [style.height.px]="height()" role="img" [attr.aria-label]="label() + ' The numbers are in the table under Show numbers.'">
      <ngx-charts-bar-horizontal
        [view]="view()!"
        [results]="bars()"
        [scheme]="scheme"
        [xAxis]="true"
        [yAxis]="true"
        [xScaleMin]="0"
        [xScaleMax]="1"
        [showDataLabel]="true"
        [dataLabelFormatting]="percent"
        [xAxisTickFormatting]="percent"
        [trimYAxisTicks]="false"
        [referenceLines]="referenceLines()"
        [showRefLines]="threshold() !== null"
        [showRefLabels]="false"
        [animations]="false"
      >
        <ng-template #tooltipTemplate let-model="model">
          <div class="tip">{{ model.name }}: {{ rate(model.value) }}</div>
        </ng-template>
      </ngx-charts-bar-horizontal>
    </div>
  `,
  styles: `
    :host ::ng-deep .ngx-charts .refline-path {
      stroke: #1f2a36;
      stroke-width: 1.5;
    }
    .tip {
      padding: 4px 6px;
      font-size: 12px;
    }
  `,
})
export class RateBars {
  /** Each bar's name should carry its sample size: the chart shows no other. */
  readonly bars = input.required<readonly { name: string; value: number }[]>();
  readonly label = input.required<string>();
  readonly threshold = input<number | null>(null);

  private readonly printMode = inject(PrintMode);
  protected readonly scheme = SCHEME;
  protected readonly rate = formatRate;
  protected readonly percent = (v: number) => `${Math.round(v * 100)} %`;
  protected readonly height = computed(() => 48 + ROW * this.bars().length);
  protected readonly referenceLines = computed(() => (this.threshold() === null ? [] : [{ name: 'Winning grade', value: this.threshold()! }]));
  /** On paper a fixed width that fits a portrait page; on screen the box decides. */
  protected readonly view = computed<[number, number] | undefined>(() => (this.printMode.printing() ? [640, this.height()] : undefined));
}
