/**
 * ln Γ(x) for x > 0 by the Lanczos approximation (g = 7, nine terms; relative error about 1e-15),
 * with the reflection formula below 0.5.
 */
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];
const HALF_LN_2PI = 0.5 * Math.log(2 * Math.PI);

export function logGamma(x: number): number {
  if (!(x > 0)) throw new RangeError(`logGamma needs x > 0 (got ${x})`);
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x);
  const y = x - 1;
  let sum = LANCZOS[0];
  for (let i = 1; i < LANCZOS.length; i++) sum += LANCZOS[i] / (y + i);
  const t = y + 7.5;
  return HALF_LN_2PI + (y + 0.5) * Math.log(t) - t + Math.log(sum);
}

/** ln B(a, b) = ln Γ(a) + ln Γ(b) − ln Γ(a + b). */
export function logBeta(a: number, b: number): number {
  return logGamma(a) + logGamma(b) - logGamma(a + b);
}
