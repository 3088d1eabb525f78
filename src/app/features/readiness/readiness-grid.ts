import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import { formatInterval, formatRate, snapsText } from '../progress/rate-text';
import { cellMarks, legendEntries, type CellMark } from './cell-marks';
import { ReadinessCellDialog, type ReadinessCellData } from './readiness-cell-dialog';
import type { Readiness, ReadinessCell } from './readiness-types';

interface GridCell {
  cell: ReadinessCell;
  marks: CellMark[];
  tone: 'none' | 'low' | 'mid' | 'good';
  tip: string;
}

/** Concepts × fronts: reps and plus rate per cell, with "few reps" and "below the winning grade" in words and symbols. */
@Component({
  selector: 'tw-readiness-grid',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, MatTooltipModule],
  templateUrl: './readiness-grid.html',
  styleUrl: './readiness-grid.scss',
})
export class ReadinessGrid {
  readonly readiness = input.required<Readiness>();
  private readonly dialog = inject(MatDialog);
  protected readonly rate = formatRate;
  protected readonly snaps = snapsText;

  protected readonly legend = computed(() => legendEntries(this.readiness().fewReps, this.readiness().winningThreshold));

  protected readonly rows = computed(() => {
    const r = this.readiness();
    const byKey = new Map(r.cells.map((c) => [`${c.conceptId}:${c.frontId}`, c]));
    return r.concepts.map((concept) => ({
      concept,
      cells: r.fronts.map((front) => {
        const cell = byKey.get(`${concept.id}:${front.id}`) ?? emptyCell(concept.id, front.id);
        return { cell, marks: cellMarks(cell), tone: toneOf(cell, r.winningThreshold), tip: tipOf(concept.name, front.name, cell) } satisfies GridCell;
      }),
    }));
  });

  protected markText(marks: readonly CellMark[]): string {
    return marks.map((m) => m.text).join(', ');
  }

  protected open(concept: string, front: string, cell: ReadinessCell): void {
    const r = this.readiness();
    this.dialog.open<ReadinessCellDialog, ReadinessCellData>(ReadinessCellDialog, { data: { concept, front, cell, threshold: r.winningThreshold, fewReps: r.fewReps }, width: '400px' });
  }
}

function emptyCell(conceptId: number, frontId: number): ReadinessCell {
  return { conceptId, frontId, reps: 0, gameReps: 0, practiceReps: 0, plus: 0, rate: null, interval: null, fewReps: true, belowWinningGrade: false };
}

/** Shading only repeats what the words say; a cell reads the same in black and white. */
function toneOf(cell: ReadinessCell, threshold: number): GridCell['tone'] {
  if (cell.rate === null) return 'none';
  if (cell.rate < threshold) return 'low';
  return cell.fewReps ? 'mid' : 'good';
}

function tipOf(concept: string, front: string, cell: ReadinessCell): string {
  if (cell.reps === 0) return `${concept} against ${front}: no reps yet`;
  return `${concept} against ${front}: ${formatRate(cell.rate)} plus of ${snapsText(cell.reps, 'rep')} (95 % interval ${formatInterval(cell.interval)}); ${cell.gameReps} game, ${cell.practiceReps} practice`;
}
