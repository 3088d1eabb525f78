import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { wilsonInterval } from '@shared/stats';
import { NumbersToggle } from '../progress/numbers-toggle';
import { RateBars } from '../progress/rate-bars';
import { formatInterval, formatRate, shortDate, snapsText } from '../progress/rate-text';
import type { LineDashboard } from './readiness-types';

/** The unit grade by game (share of snaps on which every graded lineman was plus), as bars; numbers a click away. */
@Component({
  selector: 'tw-unit-grade-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [NumbersToggle, RateBars],
  template: `
    <div class="head">
      <p class="tw-hint">Share of each game's snaps on which every graded lineman was plus. Each bar is named with its snaps.</p>
      <tw-numbers-toggle [(open)]="showNumbers" controls="unit-numbers" />
    </div>
    @if (bars().length === 0) {
      <p class="tw-hint">No graded games in this season yet.</p>
    } @else {
      <tw-rate-bars [bars]="bars()" label="Unit grade by game." />
    }
    @if (showNumbers()) {
      <div class="tw-table-scroll">
        <table class="tw-numbers" id="unit-numbers">
          <caption class="tw-visually-hidden">Unit grade by game</caption>
          <thead>
            <tr><th scope="col">Date</th><th scope="col">Game</th><th scope="col" class="num">Snaps</th><th scope="col" class="num">All plus</th><th scope="col" class="num">Unit grade</th><th scope="col" class="num">95 % interval</th></tr>
          </thead>
          <tbody>
            @for (g of rows(); track g.sessionId) {
              <tr><td>{{ date(g.date) }}</td><td>{{ g.title }}</td><td class="num">{{ g.snaps }}</td><td class="num">{{ g.allPlus }}</td><td class="num">{{ rate(g.rate) }}</td><td class="num">{{ range(g.interval) }}</td></tr>
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
export class UnitGradeChart {
  readonly games = input.required<LineDashboard['games']>();
  protected readonly showNumbers = signal(false);
  protected readonly rate = formatRate;
  protected readonly range = formatInterval;
  protected readonly date = shortDate;

  /** The interval is ours (Wilson, from shared/stats): the API sends counts only. */
  protected readonly rows = computed(() => this.games().map((g) => ({ ...g, interval: g.snaps > 0 ? wilsonInterval(g.allPlus, g.snaps) : null })));
  protected readonly bars = computed(() => this.games().filter((g) => g.rate !== null).map((g) => ({ name: `${g.title} · ${snapsText(g.snaps)}`, value: g.rate! })));
}
