/**
 * Student's t for whole degrees of freedom, exact by the finite trigonometric series of
 * Abramowitz & Stegun 26.7.3–26.7.4 (no incomplete beta function needed).
 */

/** P(|T| ≤ t) for T ~ t(df). */
export function studentTCentral(t: number, df: number): number {
  if (!Number.isInteger(df) || df < 1) throw new RangeError(`df must be a whole number ≥ 1 (got ${df})`);
  const theta = Math.atan(Math.abs(t) / Math.sqrt(df));
  const sin = Math.sin(theta);
  const cos2 = Math.cos(theta) ** 2;
  if (df % 2 === 0) {
    // sinθ·(1 + ½cos²θ + (1·3)/(2·4)cos⁴θ + … up to cos^(df−2)θ)
    let term = 1;
    let sum = 1;
    for (let k = 2; k <= df - 2; k += 2) {
      term *= ((k - 1) / k) * cos2;
      sum += term;
    }
    return sin * sum;
  }
  // (2/π)(θ + sinθ·(cosθ + (2/3)cos³θ + … up to cos^(df−2)θ)); just 2θ/π when df = 1
  if (df === 1) return (2 * theta) / Math.PI;
  let term = Math.cos(theta);
  let sum = term;
  for (let k = 3; k <= df - 2; k += 2) {
    term *= ((k - 1) / k) * cos2;
    sum += term;
  }
  return (2 / Math.PI) * (theta + sin * sum);
}

/** The t with P(|T| ≤ t) = confidence (e.g. 0.95 → t₀.₉₇₅), by bisection to double precision. */
export function studentTCritical(confidence: number, df: number): number {
  if (!(confidence > 0 && confidence < 1)) throw new RangeError('confidence must be between 0 and 1');
  let low = 0;
  let high = 1;
  while (studentTCentral(high, df) < confidence) high *= 2;
  for (let i = 0; i < 200 && high - low > 1e-15 * high; i++) {
    const mid = (low + high) / 2;
    if (studentTCentral(mid, df) < confidence) low = mid;
    else high = mid;
  }
  return (low + high) / 2;
}
