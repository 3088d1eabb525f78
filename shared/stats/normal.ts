/** Standard normal distribution, written out so the browser bundle needs no stats library. */

/** The two-sided 95 % normal quantile, Φ⁻¹(0.975), used for every 95 % interval and test here. */
export const Z95 = 1.959963984540054;

const SQRT_PI = Math.sqrt(Math.PI);

/**
 * Complementary error function to near double precision: the positive-term series
 * erf(x) = 2/√π·e^(−x²)·Σ 2ⁿx^(2n+1)/(1·3·…·(2n+1)) below 2.5 (no cancellation), and the
 * Laplace continued fraction (modified Lentz) above, where 1 − erf would lose the tail.
 */
export function erfc(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x < 0) return 2 - erfc(-x);
  if (x < 2.5) {
    let term = x;
    let sum = x;
    for (let n = 1; n < 200 && term > sum * 1e-17; n++) {
      term *= (2 * x * x) / (2 * n + 1);
      sum += term;
    }
    return 1 - ((2 / SQRT_PI) * Math.exp(-x * x) * sum);
  }
  if (x > 27) return 0; // e^(−729) underflows
  // erfc(x) = e^(−x²)/√π · 1/(x + (1/2)/(x + 1/(x + (3/2)/(x + …))))
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let k = 1; k < 500; k++) {
    const a = k / 2;
    d = x + a * d;
    d = Math.abs(d) < tiny ? 1 / tiny : 1 / d;
    c = x + a / c;
    if (Math.abs(c) < tiny) c = tiny;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-x * x) / SQRT_PI / f;
}

/** Φ(x), the standard normal cumulative distribution. */
export function normalCdf(x: number): number {
  return 0.5 * erfc(-x / Math.SQRT2);
}

/** Two-sided p-value of a z statistic: P(|Z| ≥ |z|) = erfc(|z|/√2), accurate far into the tail. */
export function twoSidedP(z: number): number {
  return erfc(Math.abs(z) / Math.SQRT2);
}
