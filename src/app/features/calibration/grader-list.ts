import type { GradingProgress } from '@shared/api/grading';

export interface Grader {
  graderId: number;
  name: string;
  /** Cells graded over the sessions looked at: who has graded a lot is a better pair to check. */
  cells: number;
  sessions: number;
}

/** Everyone who graded any of the sessions, most cells first (from each session's grading progress). */
export function gradersFrom(progress: readonly Pick<GradingProgress, 'graders'>[]): Grader[] {
  const byId = new Map<number, Grader>();
  for (const session of progress) {
    for (const g of session.graders) {
      const seen = byId.get(g.graderId) ?? { graderId: g.graderId, name: g.name, cells: 0, sessions: 0 };
      seen.cells += g.gradedCells;
      seen.sessions += 1;
      byId.set(g.graderId, seen);
    }
  }
  return [...byId.values()].sort((a, b) => b.cells - a.cells || a.name.localeCompare(b.name));
}
