import { wilsonInterval, type Interval } from './wilson';

/** One lineman's result on one snap; null when he has not been graded on it yet. */
export interface LinemanResult {
  playerId: string;
  result: 'plus' | 'minus' | null;
}

export interface AllPlusShare {
  /** Snaps on which every lineman on the field graded plus. */
  allPlus: number;
  /** Snaps counted: every lineman on the field has a result. */
  counted: number;
  /** Snaps left out because someone on them is not graded yet (or nobody is listed). */
  incomplete: number;
  rate: number | null;
  interval: Interval | null;
}

/** What a report knows of one snap for the unit grade: how many linemen were on the field, graded, plus. */
export interface UnitSnapCounts {
  /** The snap's listed linemen, or else the depth chart's starters: who should have a grade. */
  onField: number;
  /** Linemen with a final result on the snap. */
  graded: number;
  plus: number;
}

export type UnitSnapOutcome = 'allPlus' | 'notAllPlus' | 'incomplete';

/**
 * The one rule for a snap's unit result, used by every screen that shows a unit grade (Grade Sheet,
 * line dashboard): a snap counts only once every lineman on the field has a result — counting a
 * half-graded snap when it already has a minus, but not when it has none, would pull the share down
 * while grading is in progress — and it is all-plus when every graded lineman on it is plus.
 */
export function unitSnapOutcome(snap: UnitSnapCounts): UnitSnapOutcome {
  if (snap.onField === 0 || snap.graded === 0 || snap.graded < snap.onField) return 'incomplete';
  return snap.plus === snap.graded ? 'allPlus' : 'notAllPlus';
}

/** Share of snaps on which the whole unit won, over the snaps that count (see unitSnapOutcome). */
export function unitGrade(snaps: readonly UnitSnapCounts[]): AllPlusShare {
  let allPlus = 0;
  let counted = 0;
  for (const snap of snaps) {
    const outcome = unitSnapOutcome(snap);
    if (outcome === 'incomplete') continue;
    counted++;
    if (outcome === 'allPlus') allPlus++;
  }
  return {
    allPlus,
    counted,
    incomplete: snaps.length - counted,
    rate: counted === 0 ? null : allPlus / counted,
    interval: wilsonInterval(allPlus, counted),
  };
}

/** One lineman's score on one snap, higher is better (1/0 for plus/minus, or a points total). */
export interface LinemanScore {
  playerId: string;
  score: number | null;
}

export interface WeakestLink {
  /** Everyone sharing the lowest score (ties are all named). */
  playerIds: string[];
  score: number;
}

/**
 * The weakest link of a snap: the lineman (or linemen) with the lowest score among those graded.
 * Null when fewer than two are graded or all share one score — then nobody stands out (five pluses
 * or five minuses alike).
 */
export function weakestLink(snap: readonly LinemanScore[]): WeakestLink | null {
  const graded = snap.filter((g): g is { playerId: string; score: number } => g.score !== null && Number.isFinite(g.score));
  if (graded.length < 2) return null;
  const low = Math.min(...graded.map((g) => g.score));
  const high = Math.max(...graded.map((g) => g.score));
  if (low === high) return null;
  return { playerIds: graded.filter((g) => g.score === low).map((g) => g.playerId), score: low };
}

/** How many snaps each lineman was (one of) the weakest link on; players never weakest are absent. */
export function weakestLinkCounts(snaps: readonly (readonly LinemanScore[])[]): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const snap of snaps) {
    for (const id of weakestLink(snap)?.playerIds ?? []) counts[id] = (counts[id] ?? 0) + 1;
  }
  return counts;
}

/** Each lineman's result on a snap from the ids of those who graded plus and those who graded minus. */
export function linemanResults(plusIds: readonly number[], minusIds: readonly number[]): LinemanResult[] {
  return [...plusIds.map((id) => ({ playerId: String(id), result: 'plus' as const })), ...minusIds.map((id) => ({ playerId: String(id), result: 'minus' as const }))];
}

/** Plus/minus results as scores (plus 1, minus 0, not graded null) for `weakestLink`. */
export function resultScores(snap: readonly LinemanResult[]): LinemanScore[] {
  return snap.map((g) => ({ playerId: g.playerId, score: g.result === null ? null : g.result === 'plus' ? 1 : 0 }));
}
