import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { formatInterval, formatRate, snapsText } from '../progress/rate-text';
import { cellMarks } from './cell-marks';
import type { ReadinessCell } from './readiness-types';

export interface ReadinessCellData {
  concept: string;
  front: string;
  cell: ReadinessCell;
  threshold: number;
  fewReps: number;
}

/** One cell of the grid in full: rate with interval, game and practice reps, and what the marks mean. */
@Component({
  selector: 'tw-readiness-cell-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatDialogModule, MatIconModule],
  template: `
    <h2 mat-dialog-title>{{ data.concept }} against {{ data.front }}</h2>
    <mat-dialog-content>
      @if (data.cell.reps === 0) {
        <p>No graded reps of this yet, in games or practice.</p>
      } @else {
        <p class="big">{{ rate(data.cell.rate) }} plus</p>
        <p>{{ data.cell.plus }} plus of {{ snaps(data.cell.reps, 'rep') }}; 95 % interval {{ range(data.cell.interval) }}.</p>
      }
      <table class="split">
        <tbody>
          <tr><th scope="row">Game reps</th><td>{{ data.cell.gameReps }}</td></tr>
          <tr><th scope="row">Practice reps</th><td>{{ data.cell.practiceReps }}</td></tr>
          <tr><th scope="row">All reps</th><td>{{ data.cell.reps }}</td></tr>
        </tbody>
      </table>
      @for (m of marks; track m.key) {
        <p class="mark"><mat-icon aria-hidden="true">{{ m.icon }}</mat-icon> <span aria-hidden="true">{{ m.symbol }}</span> {{ m.text }}</p>
      }
      <p class="hint">Every lineman's graded snap counts as one rep. "Few reps" means fewer than {{ data.fewReps }}; the winning grade is {{ rate(data.threshold) }}.</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button mat-dialog-close type="button">Close</button>
    </mat-dialog-actions>
  `,
  styles: `
    .big {
      font: var(--mat-sys-headline-medium);
      margin: 0;
    }
    .split th {
      text-align: left;
      padding-right: 16px;
      font-weight: 400;
    }
    .split td {
      text-align: right;
      font-variant-numeric: tabular-nums;
    }
    .mark {
      display: flex;
      align-items: center;
      gap: 4px;
      font-weight: 600;
    }
    .hint {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class ReadinessCellDialog {
  protected readonly data = inject<ReadinessCellData>(MAT_DIALOG_DATA);
  protected readonly marks = cellMarks(this.data.cell);
  protected readonly rate = formatRate;
  protected readonly range = formatInterval;
  protected readonly snaps = snapsText;
}
