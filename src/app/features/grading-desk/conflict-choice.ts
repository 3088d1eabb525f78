import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { Grade } from '@shared/api/grading';
import { describeDraft } from './cell-view';
import type { GradeColumn } from './grade-columns';
import { draftFromGrade, type GradeDraft } from './grade-draft';

/**
 * A save met a newer grade on the server (409). Shows what differs, the coach's value beside the
 * server's, and lets him keep his (sent again over the newer version) or take the server's.
 */
@Component({
  selector: 'tw-conflict-choice',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatIconModule],
  template: `
    <section class="tw-alert tw-alert-attention" role="alert" data-testid="conflict">
      <mat-icon aria-hidden="true">call_split</mat-icon>
      <div class="body">
        <p>
          <strong>{{ who() }}: this grade changed on the server</strong> (version {{ theirs().version }}, {{ theirs().graderName }},
          {{ theirs().updatedAt | date: 'd MMM, HH:mm' }}) after you last loaded it. Which one stays?
        </p>
        <table>
          <thead>
            <tr><th scope="col">Part</th><th scope="col">Yours (not saved)</th><th scope="col">On the server</th></tr>
          </thead>
          <tbody>
            @for (line of differences(); track line.label) {
              <tr><th scope="row">{{ line.label }}</th><td data-testid="mine">{{ line.mine }}</td><td data-testid="theirs">{{ line.theirs }}</td></tr>
            } @empty {
              <tr><td colspan="3">Both say the same; either choice keeps these marks.</td></tr>
            }
          </tbody>
        </table>
        <div class="tw-actions">
          <button mat-flat-button type="button" (click)="keepMine.emit()">Keep mine</button>
          <button mat-stroked-button type="button" (click)="takeTheirs.emit()">Take the server's</button>
        </div>
      </div>
    </section>
  `,
  styles: `
    .body {
      flex: 1;
    }
    table {
      border-collapse: collapse;
      margin: 6px 0;
    }
    th,
    td {
      border: 1px solid var(--mat-sys-outline-variant);
      padding: 2px 8px;
      text-align: left;
    }
  `,
})
export class ConflictChoice {
  readonly who = input.required<string>();
  readonly mine = input.required<GradeDraft>();
  readonly theirs = input.required<Grade>();
  readonly columns = input.required<readonly GradeColumn[]>();
  readonly keepMine = output<void>();
  readonly takeTheirs = output<void>();

  protected readonly differences = computed(() => {
    const mine = describeDraft(this.mine(), this.columns());
    const theirs = describeDraft(draftFromGrade(this.theirs()), this.columns());
    return mine.flatMap((line, i) => (line.text === theirs[i].text ? [] : [{ label: line.label, mine: line.text, theirs: theirs[i].text }]));
  });
}
