import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { chartWeekLabel } from '@shared/depth-chart';
import { describeChange, type ChartChange } from './describe-change';

/** Who changed the depth chart, when, why and for which week, and what moved. */
@Component({
  selector: 'tw-change-history',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe],
  template: `
    @if (rows().length === 0) {
      <p class="tw-hint">No changes saved in this season yet.</p>
    } @else {
      <ol class="changes" data-testid="history">
        @for (row of rows(); track row.change.id) {
          <li>
            <p class="who"><strong>{{ row.change.by }}</strong> · {{ row.change.at | date: 'EEE d MMM y, HH:mm' }} · <span class="week">{{ row.week }}</span></p>
            <p class="why">{{ row.change.reason ? '“' + row.change.reason + '”' : 'No reason given' }}</p>
            @if (row.lines.length > 0) {
              <ul>
                @for (line of row.lines; track line) {
                  <li>{{ line }}</li>
                }
              </ul>
            } @else {
              <p class="tw-hint">Saved without a change in order.</p>
            }
          </li>
        }
      </ol>
    }
  `,
  styles: `
    .changes {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    .changes > li {
      border-left: 3px solid var(--mat-sys-outline-variant);
      padding: 4px 12px;
      margin-bottom: 10px;
    }
    p {
      margin: 0;
    }
    .why {
      font-style: italic;
    }
    ul {
      margin: 4px 0 0;
      padding-left: 18px;
      font: var(--mat-sys-body-small);
    }
  `,
})
export class ChangeHistory {
  readonly changes = input.required<readonly ChartChange[]>();
  readonly nameOf = input.required<(playerId: number) => string>();
  protected readonly rows = computed(() => this.changes().map((change) => ({ change, week: `for ${chartWeekLabel(change.week)}`, lines: describeChange(change, this.nameOf()) })));
}
