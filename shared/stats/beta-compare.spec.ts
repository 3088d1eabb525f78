import fc from 'fast-check';
import { probabilityBetaExceeds, probabilityRateHigher } from './beta-compare';
import { logGamma } from './log-gamma';
import { jStat } from './reference-libraries.testing';

/**
 * P(A > B) = ∫ f_B(x)·(1 − I_x(αA, βA)) dx with f_B = jStat.beta.pdf and I_x = jStat.ibeta
 * (jstat 1.9.6), by composite Simpson over B's posterior ±14 standard deviations (the rest of its
 * mass is far below 1e-12). Independent of the finite sum under test.
 */
function integrated(aA: number, bA: number, aB: number, bB: number, intervals = 4000): number {
  const mean = aB / (aB + bB);
  const sd = Math.sqrt(jStat.beta.variance(aB, bB));
  const from = Math.max(0, mean - 14 * sd);
  const to = Math.min(1, mean + 14 * sd);
  const h = (to - from) / intervals;
  const f = (x: number) => jStat.beta.pdf(x, aB, bB) * (1 - jStat.ibeta(x, aA, bA));
  let sum = f(from) + f(to);
  for (let i = 1; i < intervals; i++) sum += (i % 2 === 1 ? 4 : 2) * f(from + i * h);
  return (sum * h) / 3;
}

describe('probabilityRateHigher (Beta(1, 1) priors)', () => {
  test('the brief\'s example: 62 % of 240 against 55 % of 180 → 0.93', () => {
    expect(probabilityRateHigher(149, 91, 99, 81)).toBeCloseTo(0.93, 2);
  });

  test.each([
    [149, 91, 99, 81],
    [81, 182, 15, 133],
    [0, 0, 0, 0],
    [10, 0, 0, 10],
    [3, 7, 5, 5],
    [40, 12, 35, 20],
    [1, 29, 0, 20],
    [180, 120, 300, 190],
    [600, 400, 560, 440],
  ])('plus/minus A %d/%d, B %d/%d agrees with numerical integration (jStat.ibeta) to 1e-6', (pA, mA, pB, mB) => {
    expect(Math.abs(probabilityRateHigher(pA, mA, pB, mB) - integrated(pA + 1, mA + 1, pB + 1, mB + 1))).toBeLessThan(1e-6);
  });

  // Speed is measured in bench/, never asserted here (a busy machine must not fail the build).
  test('large samples (thousands of snaps) still agree with integration', () => {
    const exact = probabilityRateHigher(2600, 1900, 2500, 2000);
    expect(Math.abs(exact - integrated(2601, 1901, 2501, 2001))).toBeLessThan(1e-6);
  });

  test('closed forms: one side with no snaps is uniform, so P(A > B) = E[B-complement]', () => {
    // A ~ Beta(1, 1): P(A > B) = E[1 − X_B] = (minusB + 1)/(n_B + 2).
    expect(probabilityRateHigher(0, 0, 7, 2)).toBeCloseTo(3 / 11, 14);
    // A ~ Beta(11, 1), B ~ Beta(1, 11): P(B > A) = ∫ 11x¹⁰(1 − x)¹¹ dx = 11·B(11, 12).
    const pBHigher = 11 * Math.exp(logGamma(11) + logGamma(12) - logGamma(23));
    expect(1 - probabilityRateHigher(10, 0, 0, 10)).toBeCloseTo(pBHigher, 14);
  });

  test('identical records → even (to 1e-12)', () => {
    expect(probabilityRateHigher(120, 80, 120, 80)).toBeCloseTo(0.5, 12);
    expect(probabilityRateHigher(0, 0, 0, 0)).toBeCloseTo(0.5, 12);
  });

  const side = fc.tuple(fc.integer({ min: 0, max: 4000 }), fc.integer({ min: 0, max: 4000 }));
  test('property: P(A > B) + P(B > A) = 1, within [0, 1]', () => {
    fc.assert(
      fc.property(side, side, ([pA, mA], [pB, mB]) => {
        const ab = probabilityRateHigher(pA, mA, pB, mB);
        const ba = probabilityRateHigher(pB, mB, pA, mA);
        return ab >= 0 && ab <= 1 && Math.abs(ab + ba - 1) < 1e-9;
      }),
    );
  });

  // Tolerance 1e-9: the exact sum runs over thousands of terms in double precision, which leaves
  // an absolute error near 1e-12 on probabilities that are themselves ~1e-11 (seen: 688/57 vs
  // 3989/102). Accuracy proper is pinned by the integration checks above (1e-6).
  test('property: one more plus for A never lowers P(A > B)', () => {
    fc.assert(fc.property(side, side, ([pA, mA], [pB, mB]) => probabilityRateHigher(pA + 1, mA, pB, mB) >= probabilityRateHigher(pA, mA, pB, mB) - 1e-9));
  });

  test('all four summation routes agree (each parameter the smallest in turn)', () => {
    // aA smallest, bB smallest, aB smallest, bA smallest: the same pair of posteriors reflected.
    const direct = probabilityBetaExceeds(3, 9, 6, 7);
    expect(probabilityBetaExceeds(9, 3, 7, 6)).toBeCloseTo(1 - direct, 13); // reflect both
    expect(probabilityBetaExceeds(6, 7, 3, 9)).toBeCloseTo(1 - direct, 13); // swap
    expect(probabilityBetaExceeds(7, 6, 9, 3)).toBeCloseTo(direct, 13); // swap and reflect
  });

  test('bad input throws', () => {
    expect(() => probabilityRateHigher(-1, 0, 0, 0)).toThrow(RangeError);
    expect(() => probabilityBetaExceeds(0.5, 1, 1, 1)).toThrow(RangeError);
  });
});
