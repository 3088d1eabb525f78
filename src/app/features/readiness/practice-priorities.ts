import { formatRate, snapsText } from '../progress/rate-text';
import type { Readiness, ReadinessCell } from './readiness-types';

export interface PracticePriority {
  conceptId: number;
  frontId: number;
  concept: string;
  front: string;
  cell: ReadinessCell;
  /** Why it is on the list, in words. */
  why: string;
}

/**
 * Where to put practice reps (our rule): every cell that is below the winning grade or has few reps.
 * Cells both low and thin come first (the line is not good at it and has barely practised it), then
 * low cells whose whole 95 % interval sits under the line (surely low), then the other low cells by
 * rate, then thin cells by reps, fewest first. Ties keep the grid's order.
 */
export function practicePriorities(readiness: Readiness): PracticePriority[] {
  const concepts = new Map(readiness.concepts.map((c, i) => [c.id, { name: c.name, order: i }]));
  const fronts = new Map(readiness.fronts.map((f, i) => [f.id, { name: f.name, order: i }]));
  const threshold = readiness.winningThreshold;
  const tier = (c: ReadinessCell) => {
    if (c.belowWinningGrade && c.fewReps) return 0;
    if (c.belowWinningGrade && c.interval !== null && c.interval[1] < threshold) return 1;
    if (c.belowWinningGrade) return 2;
    return 3;
  };
  const gridOrder = (c: ReadinessCell) => (concepts.get(c.conceptId)?.order ?? 0) * 1000 + (fronts.get(c.frontId)?.order ?? 0);
  return readiness.cells
    .filter((c) => c.fewReps || c.belowWinningGrade)
    .sort((a, b) => {
      const byTier = tier(a) - tier(b);
      if (byTier !== 0) return byTier;
      const t = tier(a);
      const byValue = t === 3 ? a.reps - b.reps : (a.rate ?? 0) - (b.rate ?? 0);
      return byValue !== 0 ? byValue : gridOrder(a) - gridOrder(b);
    })
    .map((cell) => ({
      conceptId: cell.conceptId,
      frontId: cell.frontId,
      concept: concepts.get(cell.conceptId)?.name ?? '?',
      front: fronts.get(cell.frontId)?.name ?? '?',
      cell,
      why: reason(cell, threshold),
    }));
}

function reason(cell: ReadinessCell, threshold: number): string {
  const parts: string[] = [];
  if (cell.reps === 0) parts.push('no reps yet');
  else if (cell.fewReps) parts.push(`only ${snapsText(cell.reps, 'rep')} (${cell.gameReps} game, ${cell.practiceReps} practice)`);
  if (cell.belowWinningGrade) {
    const sure = cell.interval !== null && cell.interval[1] < threshold;
    parts.push(`${formatRate(cell.rate)} plus, under the ${formatRate(threshold)} winning grade${sure ? ' even at the top of its 95 % interval' : ''}`);
  }
  return parts.join('; ');
}
