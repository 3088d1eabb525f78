import type { RateShape, SplitRow } from '../progress/development-types';

/** `?players=12,22` → [12, 22]: whole positive ids, each once, at most four; anything else is dropped. */
export function parsePlayerIds(text: string | null | undefined): number[] {
  const ids = (text ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter((s) => /^\d+$/.test(s))
    .map(Number)
    .filter((n) => n > 0);
  return [...new Set(ids)].slice(0, 4);
}

export interface SplitComparisonRow {
  value: string;
  /** One entry per player, in the players' order; undefined when he has no snaps there. */
  cells: (RateShape | undefined)[];
  totalSnaps: number;
}

/**
 * One split (concept or front) side by side: the values any of the players has snaps in, most
 * snaps overall first, at most `limit` rows (the rest are on each player's Progress page).
 */
export function splitComparison(perPlayer: readonly (readonly SplitRow[])[], limit = 10): SplitComparisonRow[] {
  const values = new Map<string, number>();
  for (const rows of perPlayer) for (const r of rows) values.set(r.value, (values.get(r.value) ?? 0) + r.snaps);
  return [...values.entries()]
    .sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]))
    .slice(0, limit)
    .map(([value, totalSnaps]) => ({ value, totalSnaps, cells: perPlayer.map((rows) => rows.find((r) => r.value === value)) }));
}
