import { assertCount } from './counts';
import { logBeta } from './log-gamma';

/**
 * P(X₂ > X₁) for independent X₁ ~ Beta(a1, b1), X₂ ~ Beta(a2, b2) with whole a2: the finite sum
 * Σ_{i<a2} B(a1 + i, b1 + b2) / ((b2 + i)·B(1 + i, b2)·B(a1, b1)). Successive terms differ by the
 * factor (a1 + i)(b2 + i) / ((a1 + b1 + b2 + i)(i + 1)), so only the first needs ln Γ; the sum is
 * kept in logs because the first term can underflow when the other terms do not.
 */
function secondExceedsFirst(a1: number, b1: number, a2: number, b2: number): number {
  let logTerm = logBeta(a1, b1 + b2) - logBeta(a1, b1);
  let logMax = logTerm;
  let scaled = 1; // Σ exp(logTermᵢ − logMax)
  for (let i = 0; i < a2 - 1; i++) {
    logTerm += Math.log(((a1 + i) * (b2 + i)) / ((a1 + b1 + b2 + i) * (i + 1)));
    if (logTerm > logMax) {
      scaled = scaled * Math.exp(logMax - logTerm) + 1;
      logMax = logTerm;
    } else {
      scaled += Math.exp(logTerm - logMax);
    }
  }
  return Math.min(1, Math.max(0, Math.exp(logMax) * scaled));
}

/**
 * P(X_A > X_B) for independent X_A ~ Beta(aA, bA), X_B ~ Beta(aB, bB), all whole numbers ≥ 1.
 * Exact (finite sum). Of the four equivalent sums (swap A and B, or reflect x → 1 − x, which swaps
 * a and b) it takes the one with the fewest terms: min(aA, bA, aB, bB), so a 5,000-snap comparison
 * costs a few thousand multiplications at most.
 */
export function probabilityBetaExceeds(aA: number, bA: number, aB: number, bB: number): number {
  for (const [v, name] of [[aA, 'aA'], [bA, 'bA'], [aB, 'aB'], [bB, 'bB']] as const) {
    if (!Number.isInteger(v) || v < 1) throw new RangeError(`${name} must be a whole number ≥ 1 (got ${v})`);
  }
  const fewest = Math.min(aA, bA, aB, bB);
  if (fewest === aA) return secondExceedsFirst(aB, bB, aA, bA);
  if (fewest === bB) return secondExceedsFirst(bA, aA, bB, aB); // 1 − X_B > 1 − X_A
  if (fewest === aB) return 1 - secondExceedsFirst(aA, bA, aB, bB);
  return 1 - secondExceedsFirst(bB, aB, bA, aA); // 1 − P(1 − X_A > 1 − X_B)
}

/**
 * Probability that A's true plus rate is higher than B's, each with a flat Beta(1, 1) prior, so the
 * posteriors are Beta(plus + 1, minus + 1). With no snaps on either side it is 0.5.
 */
export function probabilityRateHigher(plusA: number, minusA: number, plusB: number, minusB: number): number {
  for (const [v, name] of [[plusA, 'plusA'], [minusA, 'minusA'], [plusB, 'plusB'], [minusB, 'minusB']] as const) assertCount(v, name);
  return probabilityBetaExceeds(plusA + 1, minusA + 1, plusB + 1, minusB + 1);
}
