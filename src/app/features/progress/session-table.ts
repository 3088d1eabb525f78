import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { formatInterval, formatRate, shortDate } from './rate-text';
import type { TrendPoint } from './trend-series';

const KIND_LABELS: Record<string, string | undefined> = { game: 'Game', scrimmage: 'Scrimmage', practice: 'Practice' };

/** Sessions as numbers: date, session, snaps, plus, rate, 95 % interval and the rolling rate. */
@Component({
  selector: 'tw-session-table',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="tw-table-scroll">
      <table class="tw-numbers" [id]="tableId()">
        <caption class="tw-visually-hidden">{{ caption() }}</caption>
        <thead>
          <tr>
            <th scope="col">Date</th>
            <th scope="col">Session</th>
            @if (showKind()) {
              <th scope="col">Kind</th>
            }
            <th scope="col" class="num">Snaps</th>
            <th scope="col" class="num">Plus</th>
            <th scope="col" class="num">Rate</th>
            <th scope="col" class="num">95 % interval</th>
            <th scope="col" class="num">Rolling</th>
          </tr>
        </thead>
        <tbody>
          @for (p of rows(); track p.sessionId) {
            <tr>
              <td>{{ date(p.date) }}</td>
              <td>{{ p.title ?? '' }}</td>
              @if (showKind()) {
                <td>{{ kinds[p.kind ?? ''] ?? p.kind }}</td>
              }
              <td class="num">{{ p.snaps }}</td>
              <td class="num">{{ p.plus }}</td>
              <td class="num">{{ rate(p.rate) }}</td>
              <td class="num">{{ range(p.interval) }}</td>
              <td class="num">{{ rate(p.rolling) }}</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
})
export class SessionTable {
  readonly rows = input.required<readonly (TrendPoint & { kind?: string })[]>();
  readonly caption = input.required<string>();
  readonly tableId = input<string | null>(null);
  readonly showKind = input(false);
  protected readonly kinds = KIND_LABELS;
  protected readonly rate = formatRate;
  protected readonly range = formatInterval;
  protected readonly date = shortDate;
}
