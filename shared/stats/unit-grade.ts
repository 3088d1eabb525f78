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

/**
 * Share of snaps on which the whole unit won: every lineman on the field graded plus. Only fully
 * graded snaps count — counting a half-graded snap when it already has a minus, but not when it has
 * none, would pull the share down while grading is in progress.
 */
export function allPlusShare(snaps: readonly (readonly LinemanResult[])[]): AllPlusShare {
  let allPlus = 0;
  let counted = 0;
  for (const snap of snaps) {
    if (snap.length === 0 || snap.some((g) => g.result === null)) continue;
    counted++;
    if (snap.every((g) => g.result === 'plus')) allPlus++;
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

/** Plus/minus results as scores (plus 1, minus 0, not graded null) for `weakestLink`. */
export function resultScores(snap: readonly LinemanResult[]): LinemanScore[] {
  return snap.map((g) => ({ playerId: g.playerId, score: g.result === null ? null : g.result === 'plus' ? 1 : 0 }));
}
