import { assertCount, type PlusMinus } from './counts';

function assertWindow(window: number): void {
  if (!Number.isInteger(window) || window < 1) throw new RangeError(`window must be a whole number ≥ 1 (got ${window})`);
}

/** Mean of the last `window` values at each position; null until a full window exists. */
export function rollingAverage(values: readonly number[], window: number): (number | null)[] {
  assertWindow(window);
  // Summed afresh per window (seasons are short) so no running-sum drift creeps in.
  return values.map((_, i) => (i + 1 < window ? null : values.slice(i + 1 - window, i + 1).reduce((a, b) => a + b, 0) / window));
}

/**
 * Plus rate over the last `window` sessions at each session, pooling snaps (plus ÷ snaps of the
 * window, so a 6-snap session weighs less than a 60-snap one); null until `window` sessions exist
 * or when the window holds no graded snaps.
 */
export function rollingPlusRate(sessions: readonly PlusMinus[], window: number): (number | null)[] {
  assertWindow(window);
  return sessions.map((s, i) => {
    assertCount(s.plus, 'plus');
    assertCount(s.minus, 'minus');
    if (i + 1 < window) return null;
    let plus = 0;
    let snaps = 0;
    for (const w of sessions.slice(i + 1 - window, i + 1)) {
      plus += w.plus;
      snaps += w.plus + w.minus;
    }
    return snaps === 0 ? null : plus / snaps;
  });
}
