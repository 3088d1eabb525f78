import fc from 'fast-check';
import { jStat } from './reference-libraries.testing';
import { twoProportionZTest } from './two-proportion';

/**
 * Pearson's chi-square of the 2×2 table [[a, nA − a], [b, nB − b]] by the textbook formula
 * Σ (O − E)² / E with E = row total × column total / N, no continuity correction. Written here
 * because no installable package computes it (see the report); its p-value comes from
 * jStat.chisquare.cdf (jstat 1.9.6).
 */
function pearsonChiSquare(a: number, nA: number, b: number, nB: number): number {
  const table = [[a, nA - a], [b, nB - b]];
  const rows = [nA, nB];
  const cols = [a + b, nA + nB - a - b];
  const total = nA + nB;
  let chi2 = 0;
  for (let i = 0; i < 2; i++) {
    for (let j = 0; j < 2; j++) {
      const expected = (rows[i] * cols[j]) / total;
      chi2 += (table[i][j] - expected) ** 2 / expected;
    }
  }
  return chi2;
}

describe('twoProportionZTest', () => {
  test('the brief\'s example: 149/240 against 99/180', () => {
    const t = twoProportionZTest(149, 240, 99, 180)!;
    expect(t.difference).toBeCloseTo(149 / 240 - 99 / 180, 15);
    // Hand check: pooled 248/420; SE = √(p̄(1 − p̄)(1/240 + 1/180)).
    const pooled = 248 / 420;
    expect(t.z).toBeCloseTo(t.difference / Math.sqrt(pooled * (1 - pooled) * (1 / 240 + 1 / 180)), 12);
  });

  test('z² equals Pearson chi-square (no continuity correction) of the same 2×2 table; p agrees with jStat.chisquare.cdf', () => {
    for (const [a, nA, b, nB] of [[149, 240, 99, 180], [81, 263, 15, 148], [3, 10, 9, 12], [1000, 2000, 1100, 2100], [1, 30, 0, 31]]) {
      const t = twoProportionZTest(a, nA, b, nB)!;
      const chi2 = pearsonChiSquare(a, nA, b, nB);
      expect(Math.abs(t.z! ** 2 - chi2) / chi2).toBeLessThan(1e-12);
      expect(t.pValue!).toBeCloseTo(1 - jStat.chisquare.cdf(chi2, 1), 10);
      expect(t.pValue!).toBeCloseTo(2 * (1 - jStat.normal.cdf(Math.abs(t.z!), 0, 1)), 12);
    }
  });

  test('property: z² = chi-square for any table with spread', () => {
    const side = fc.integer({ min: 1, max: 3000 }).chain((n) => fc.tuple(fc.integer({ min: 0, max: n }), fc.constant(n)));
    fc.assert(
      fc.property(side, side, ([a, nA], [b, nB]) => {
        fc.pre(a + b > 0 && a + b < nA + nB);
        const t = twoProportionZTest(a, nA, b, nB)!;
        const chi2 = pearsonChiSquare(a, nA, b, nB);
        return Math.abs(t.z! ** 2 - chi2) <= 1e-9 * Math.max(1, chi2) && t.pValue! >= 0 && t.pValue! <= 1;
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
