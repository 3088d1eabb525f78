import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import type { SplitRow } from './development-types';
import { NumbersToggle } from './numbers-toggle';
import { RateBars } from './rate-bars';
import { formatInterval, formatRate, snapsText } from './rate-text';

let nextId = 0;

/** Plus rate per value of one split (concept, front, hash…) as bars, each named with its snaps; numbers a click away. */
@Component({
  selector: 'tw-split-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [NumbersToggle, RateBars],
  template: `
    <div class="head">
      <p class="tw-hint">Bars: plus rate; the dashed line is the winning grade ({{ rate(threshold()) }}). Few snaps make a bar shaky: see the intervals.</p>
      <tw-numbers-toggle [(open)]="showNumbers" [controls]="id" />
    </div>
    @if (bars().length > 0) {
      <tw-rate-bars [bars]="bars()" [threshold]="threshold()" [label]="heading() + ': plus rate by value.'" />
    } @else {
      <p class="tw-hint">No graded snaps to split yet.</p>
    }
    @if (showNumbers()) {
      <div class="tw-table-scroll">
        <table class="tw-numbers" [id]="id">
          <caption class="tw-visually-hidden">{{ heading() }}</caption>
          <thead>
            <tr><th scope="col">{{ heading() }}</th><th scope="col" class="num">Snaps</th><th scope="col" class="num">Plus</th><th scope="col" class="num">Rate</th><th scope="col" class="num">95 % interval</th></tr>
          </thead>
          <tbody>
            @for (r of rows(); track r.value) {
              <tr><td>{{ r.value }}</td><td class="num">{{ r.snaps }}</td><td class="num">{{ r.plus }}</td><td class="num">{{ rate(r.rate) }}</td><td class="num">{{ range(r.interval) }}</td></tr>
            }
          </tbody>
        </table>
      </div>
    }
  `,
  styles: `
    .head {
      display: flex;
      flex-wrap: wrap;
      justify-content: space-between;
      align-items: center;
      gap: 8px;
    }
  `,
})
export class SplitChart {
  readonly heading = input.required<string>();
  readonly rows = input.required<readonly SplitRow[]>();
  readonly threshold = input.required<number>();

  protected readonly id = `tw-split-${nextId++}`;
  protected readonly showNumbers = signal(false);
  protected readonly rate = formatRate;
  protected readonly range = formatInterval;

  /** The snap count goes into the bar's name, so no bar is read without its sample size. */
  protected readonly bars = computed(() => this.rows().filter((r) => r.rate !== null).map((r) => ({ name: `${r.value} · ${snapsText(r.snaps)}`, value: r.rate! })));
}
