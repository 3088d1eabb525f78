import { assertCount } from './counts';
import { twoSidedP } from './normal';

export interface TwoProportionTest {
  /** rateA − rateB, as a fraction. */
  difference: number;
  /** (p̂A − p̂B) / √(p̄(1 − p̄)(1/nA + 1/nB)) with the pooled p̄; null when p̄ is 0 or 1 (no spread). */
  z: number | null;
  /** Two-sided p-value of z; null with z. */
  pValue: number | null;
}

/**
 * Two-proportion z test with the pooled rate, two-sided. z² equals Pearson's chi-square of the same
 * 2×2 table without continuity correction, so the two readings never disagree. Null when either side
 * has no graded snaps.
 */
export function twoProportionZTest(plusA: number, snapsA: number, plusB: number, snapsB: number): TwoProportionTest | null {
  for (const [v, name] of [[plusA, 'plusA'], [snapsA, 'snapsA'], [plusB, 'plusB'], [snapsB, 'snapsB']] as const) assertCount(v, name);
  if (plusA > snapsA || plusB > snapsB) throw new RangeError('plus cannot exceed snaps');
  if (snapsA === 0 || snapsB === 0) return null;
  const difference = plusA / snapsA - plusB / snapsB;
  const pooled = (plusA + plusB) / (snapsA + snapsB);
  const variance = pooled * (1 - pooled) * (1 / snapsA + 1 / snapsB);
  if (variance === 0) return { difference, z: null, pValue: null };
  const z = difference / Math.sqrt(variance);
  return { difference, z, pValue: twoSidedP(z) };
}
