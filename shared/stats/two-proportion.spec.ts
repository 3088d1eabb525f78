import fc from 'fast-check';
import { chi2test, jStat } from './reference-libraries.testing';
import { twoProportionZTest } from './two-proportion';

/**
 * Pearson's chi-square independence test of the 2×2 table [[a, nA − a], [b, nB − b]] by
 * @stdlib/stats-chi2test 0.2.1 with `correct: false` (its default applies Yates' continuity
 * correction to 2×2 tables, which the z test does not have).
 */
function pearson(a: number, nA: number, b: number, nB: number): { statistic: number; pValue: number; df: number } {
  const { statistic, pValue, df } = chi2test([[a, nA - a], [b, nB - b]], { correct: false });
  return { statistic, pValue, df };
}

describe('twoProportionZTest', () => {
  test('the brief\'s example: 149/240 against 99/180', () => {
    const t = twoProportionZTest(149, 240, 99, 180)!;
    expect(t.difference).toBeCloseTo(149 / 240 - 99 / 180, 15);
    // Hand check: pooled 248/420; SE = √(p̄(1 − p̄)(1/240 + 1/180)).
    const pooled = 248 / 420;
    expect(t.z).toBeCloseTo(t.difference / Math.sqrt(pooled * (1 - pooled) * (1 / 240 + 1 / 180)), 12);
  });

  test.each([
    [149, 240, 99, 180],
    [81, 263, 15, 148],
    [3, 10, 9, 12],
    [1000, 2000, 1100, 2100],
    [1, 30, 0, 31],
    [40, 52, 35, 55],
  ])('%d/%d against %d/%d: z² equals the Pearson chi-square of @stdlib/stats-chi2test (no continuity correction); two-sided p equals its 1-df p', (a, nA, b, nB) => {
    const t = twoProportionZTest(a, nA, b, nB)!;
    const reference = pearson(a, nA, b, nB);
    expect(reference.df).toBe(1);
    expect(Math.abs(t.z! ** 2 - reference.statistic) / reference.statistic).toBeLessThan(1e-12);
    expect(t.pValue!).toBeCloseTo(reference.pValue, 12);
    // Second reference for the p-value alone: jStat's chi-square and normal CDFs (jstat 1.9.6).
    expect(t.pValue!).toBeCloseTo(1 - jStat.chisquare.cdf(reference.statistic, 1), 10);
    expect(t.pValue!).toBeCloseTo(2 * (1 - jStat.normal.cdf(Math.abs(t.z!), 0, 1)), 12);
  });

  test('the z test matches the uncorrected chi-square, not the Yates-corrected default of @stdlib', () => {
    const t = twoProportionZTest(149, 240, 99, 180)!;
    const yates = chi2test([[149, 91], [99, 81]]);
    expect(Math.abs(t.z! ** 2 - yates.statistic)).toBeGreaterThan(0.1);
    expect(t.pValue!).toBeLessThan(yates.pValue);
  });

  test('property: z² = @stdlib Pearson chi-square, p = its p, for any table with spread', () => {
    const side = fc.integer({ min: 1, max: 3000 }).chain((n) => fc.tuple(fc.integer({ min: 0, max: n }), fc.constant(n)));
    fc.assert(
      fc.property(side, side, ([a, nA], [b, nB]) => {
        fc.pre(a + b > 0 && a + b < nA + nB);
        const t = twoProportionZTest(a, nA, b, nB)!;
        const reference = pearson(a, nA, b, nB);
        return Math.abs(t.z! ** 2 - reference.statistic) <= 1e-9 * Math.max(1, reference.statistic)
          && Math.abs(t.pValue! - reference.pValue) <= 1e-9 && t.pValue! >= 0 && t.pValue! <= 1;
      }),
    );
  });

  test('equal rates → z 0, p 1; swapping sides flips the sign only', () => {
    const same = twoProportionZTest(30, 60, 45, 90)!;
    expect(same.z).toBeCloseTo(0, 15);
    expect(same.pValue).toBeCloseTo(1, 15);
    const ab = twoProportionZTest(50, 80, 30, 70)!;
    const ba = twoProportionZTest(30, 70, 50, 80)!;
    expect(ba.z).toBeCloseTo(-ab.z!, 14);
    expect(ba.pValue).toBeCloseTo(ab.pValue!, 14);
  });

  test('no spread (both 100 % or both 0 %) → z and p null; no snaps → null; bad counts throw', () => {
    expect(twoProportionZTest(40, 40, 30, 30)).toEqual({ difference: 0, z: null, pValue: null });
    expect(twoProportionZTest(0, 40, 0, 30)).toEqual({ difference: 0, z: null, pValue: null });
    expect(twoProportionZTest(0, 0, 3, 30)).toBeNull();
    expect(() => twoProportionZTest(5, 4, 1, 2)).toThrow(RangeError);
    expect(() => twoProportionZTest(-1, 4, 1, 2)).toThrow(RangeError);
  });
});
