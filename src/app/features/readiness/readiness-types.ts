import type { Interval } from '@shared/stats';

/** GET /api/teams/{teamId}/readiness (server/development/readiness.service.ts). */
export interface ReadinessCell {
  conceptId: number;
  frontId: number;
  /** Every lineman's graded snap counts once: game and practice together. */
  reps: number;
  gameReps: number;
  practiceReps: number;
  plus: number;
  rate: number | null;
  interval: Interval | null;
  fewReps: boolean;
  belowWinningGrade: boolean;
}

export interface Readiness {
  seasonId: number;
  winningThreshold: number;
  /** A cell with fewer reps than this is marked "few reps". */
  fewReps: number;
  concepts: { id: number; name: string }[];
  fronts: { id: number; name: string }[];
  cells: ReadinessCell[];
}

/** GET /api/teams/{teamId}/line-dashboard. */
export interface LineDashboard {
  seasonId: number;
  /** snaps: fully graded snaps (every lineman on the field graded); incomplete: snaps still waiting. */
  games: { sessionId: number; title: string; date: string; snaps: number; allPlus: number; incomplete: number; rate: number | null }[];
  /** Who lost a snap the rest of the line won, most often first. */
  weakestLinks: { playerId: number; name: string; snaps: number }[];
  missedAssignments: { position: string; reason: string; count: number }[];
}
