import { formatRate } from '../progress/rate-text';
import type { ReadinessCell } from './readiness-types';

export interface CellMark {
  key: 'none' | 'few' | 'below';
  /** Printed and read aloud: the mark never rests on colour alone. */
  symbol: string;
  icon: string;
  text: string;
  /** What fits in a grid cell; the legend spells it out. */
  short: string;
}

export const MARK_NONE: CellMark = { key: 'none', symbol: '○', icon: 'block', text: 'no reps', short: 'no reps' };
export const MARK_FEW: CellMark = { key: 'few', symbol: '◔', icon: 'hourglass_empty', text: 'few reps', short: 'few reps' };
export const MARK_BELOW: CellMark = { key: 'below', symbol: '▼', icon: 'south', text: 'below the winning grade', short: 'below grade' };

/** What a cell of the grid is flagged for, most telling first. */
export function cellMarks(cell: ReadinessCell): CellMark[] {
  if (cell.reps === 0) return [MARK_NONE];
  const marks: CellMark[] = [];
  if (cell.fewReps) marks.push(MARK_FEW);
  if (cell.belowWinningGrade) marks.push(MARK_BELOW);
  return marks;
}

/** The legend under the grid, with the numbers that decide each mark. */
export function legendEntries(fewReps: number, threshold: number): { mark: CellMark; meaning: string }[] {
  return [
    { mark: MARK_NONE, meaning: 'not a single graded rep yet' },
    { mark: MARK_FEW, meaning: `fewer than ${fewReps} graded reps: the rate is not to be trusted yet` },
    { mark: MARK_BELOW, meaning: `(in a cell: “below grade”) plus rate under the winning grade (${formatRate(threshold)})` },
  ];
}
