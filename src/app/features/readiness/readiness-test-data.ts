import { rateWithInterval } from '@shared/stats';
import type { LineDashboard, Readiness, ReadinessCell } from './readiness-types';

/** Invented test data for the readiness specs (the demo program: Ironvale Anvils). */
export function readinessCell(conceptId: number, frontId: number, gamePlus: number, gameMinus: number, practicePlus = 0, practiceMinus = 0): ReadinessCell {
  const r = rateWithInterval(gamePlus + practicePlus, gameMinus + practiceMinus);
  return {
    conceptId,
    frontId,
    reps: r.snaps,
    gameReps: gamePlus + gameMinus,
    practiceReps: practicePlus + practiceMinus,
    plus: r.plus,
    rate: r.rate,
    interval: r.interval,
    fewReps: r.snaps < 12,
    belowWinningGrade: r.rate !== null && r.rate < 0.8,
  };
}

export function readiness(): Readiness {
  return {
    seasonId: 5,
    winningThreshold: 0.8,
    fewReps: 12,
    concepts: [
      { id: 1, name: 'Inside zone' },
      { id: 2, name: 'Power' },
    ],
    fronts: [
      { id: 10, name: 'Over' },
      { id: 11, name: 'Bear' },
    ],
    cells: [
      readinessCell(1, 10, 60, 8, 20, 2), // 90 reps, 89 %
      readinessCell(1, 11, 3, 1, 2, 1), // 7 reps: few
      readinessCell(2, 10, 30, 20), // 50 reps, 60 %: below
      readinessCell(2, 11, 0, 0), // none
    ],
  };
}

export function lineDashboard(): LineDashboard {
  return {
    seasonId: 5,
    games: [
      { sessionId: 31, title: 'Week 1 vs Carrow Ridge', date: '2026-09-04', snaps: 60, allPlus: 27, incomplete: 0, rate: 0.45 },
      { sessionId: 33, title: 'Week 2 at Fenmoor', date: '2026-09-11', snaps: 55, allPlus: 33, incomplete: 2, rate: 0.6 },
    ],
    weakestLinks: [
      { playerId: 12, name: 'Odran Pike', snaps: 9 },
      { playerId: 14, name: 'Teodor Vance', snaps: 4 },
    ],
    missedAssignments: [
      { position: 'RG', reason: 'wrong gap or man', count: 4 },
      { position: 'LT', reason: 'wrong gap or man', count: 2 },
      { position: 'LT', reason: 'communication', count: 1 },
    ],
  };
}
