import { formatClock, MIN_SEGMENT_MS } from '@shared/film';

// The server's rule for a split (422 otherwise): every segment between cuts lasts at least this long.
export { MIN_SEGMENT_MS };

/** Whole milliseconds, no duplicates, in order: what the split request takes. */
export function sortCuts(cuts: readonly number[]): number[] {
  return [...new Set(cuts.map((c) => Math.round(c)))].sort((a, b) => a - b);
}

export type CutChange = { cuts: number[]; index: number } | { error: string };

/** A new cut at `atMs`, refused when it would leave a segment shorter than MIN_SEGMENT_MS. */
export function addCut(cuts: readonly number[], atMs: number, durationMs: number): CutChange {
  const ms = Math.round(atMs);
  if (ms < MIN_SEGMENT_MS || ms > durationMs - MIN_SEGMENT_MS) {
    return { error: 'A cut needs at least half a second of tape before and after it.' };
  }
  const near = cuts.find((c) => Math.abs(c - ms) < MIN_SEGMENT_MS);
  if (near !== undefined) {
    return { error: `Too close to the cut at ${formatClock(near)}: keep at least half a second between cuts.` };
  }
  const next = sortCuts([...cuts, ms]);
  return { cuts: next, index: next.indexOf(ms) };
}

/** Moves a cut, kept between its neighbours (and half a second from them) so the order holds. */
export function moveCut(cuts: readonly number[], index: number, toMs: number, durationMs: number): CutChange {
  if (index < 0 || index >= cuts.length) return { error: 'No such cut.' };
  const low = (index === 0 ? 0 : cuts[index - 1]) + MIN_SEGMENT_MS;
  const high = (index === cuts.length - 1 ? durationMs : cuts[index + 1]) - MIN_SEGMENT_MS;
  if (low > high) return { error: 'There is no room to move this cut.' };
  const next = [...cuts];
  next[index] = Math.round(Math.min(high, Math.max(low, toMs)));
  return { cuts: next, index };
}

export function removeCut(cuts: readonly number[], index: number): number[] {
  return cuts.filter((_, i) => i !== index);
}

/** Cuts that leave a segment shorter than the rule (a detected proposal can have them). */
export function shortCutIndexes(cuts: readonly number[], durationMs: number): Set<number> {
  const bad = new Set<number>();
  cuts.forEach((cut, i) => {
    const before = i === 0 ? 0 : cuts[i - 1];
    const after = i === cuts.length - 1 ? durationMs : cuts[i + 1];
    if (cut - before < MIN_SEGMENT_MS || after - cut < MIN_SEGMENT_MS) bad.add(i);
  });
  return bad;
}
