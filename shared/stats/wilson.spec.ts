import fc from 'fast-check';
import { normalCdf, Z95 } from './normal';
import { jStat, wilsonScoreInterval } from './reference-libraries.testing';
import { rateWithInterval, wilsonInterval } from './wilson';

describe('wilsonInterval', () => {
  // Newcombe RG (1998), "Two-sided confidence intervals for the single proportion: comparison of
  // seven methods", Statistics in Medicine 17:857–872, worked examples for method 3 (Wilson score,
  // no continuity correction). Values FROM MEMORY, to 4 decimals; not checked against the paper.
  test.each([
    [81, 263, 0.2553, 0.3662],
    [15, 148, 0.0624, 0.1605],
    [0, 20, 0, 0.1611],
    [1, 29, 0.0061, 0.1718],
    [29, 29, 0.883, 1],
  ])('Newcombe (1998) example %d/%d → %f to %f (from memory)', (x, n, low, high) => {
    const [l, h] = wilsonInterval(x, n)!;
    expect(l).toBeCloseTo(low, 4);
    expect(h).toBeCloseTo(high, 4);
  });

  // npm implementation: wilson-score-interval 2.1.0 computes the Wilson score interval without
  // continuity correction, (p̂ + z²/2n ∓ z√(p̂(1 − p̂)/n + z²/4n²)) / (1 + z²/n), with z fixed at 1.96
  // (read in its index.js). Same z → same bounds to rounding; our default z = 1.959963984540054
  // moves a bound by at most |Δz|·∂bound/∂z < 1e-5 (seen: 9.2e-6 over every x ≤ n ≤ 400).
  const wilsonCases: [number, number][] = [[81, 263], [15, 148], [0, 20], [1, 29], [29, 29], [7, 12], [149, 240], [4999, 5000], [50, 100], [1, 1]];

  test.each(wilsonCases)('%d/%d: bounds equal wilson-score-interval 2.1.0 at its z = 1.96', (x, n) => {
    const [low, high] = wilsonInterval(x, n, 1.96)!;
    const reference = wilsonScoreInterval(x, n);
    expect(Math.abs(low - reference.left)).toBeLessThan(1e-13);
    expect(Math.abs(high - reference.right)).toBeLessThan(1e-13);
  });

  test.each(wilsonCases)('%d/%d: the default 95 %% interval is within 2e-5 of wilson-score-interval 2.1.0', (x, n) => {
    const [low, high] = wilsonInterval(x, n)!;
    const reference = wilsonScoreInterval(x, n);
    expect(Math.abs(low - reference.left)).toBeLessThan(2e-5);
    expect(Math.abs(high - reference.right)).toBeLessThan(2e-5);
  });

  const counts = fc.integer({ min: 1, max: 5000 }).chain((n) => fc.tuple(fc.integer({ min: 0, max: n }), fc.constant(n)));

  test('property: equals wilson-score-interval 2.1.0 at z = 1.96 for any count', () => {
    fc.assert(
      fc.property(counts, ([x, n]) => {
        const [low, high] = wilsonInterval(x, n, 1.96)!;
        const reference = wilsonScoreInterval(x, n);
        return Math.abs(low - reference.left) < 1e-12 && Math.abs(high - reference.right) < 1e-12;
      }),
    );
  });

  // Defining property, checked with jStat (jstat 1.9.6) alone: each Wilson limit is a p where the
  // score statistic |p̂ − p| / √(p(1 − p)/n) equals z = jStat.normal.inv(0.975). The root is found by
  // bisection here, independent of the closed form under test.
  test('limits are the roots of the score statistic = jStat.normal.inv(0.975) (numerical)', () => {
    const z = jStat.normal.inv(0.975, 0, 1);
    const root = (x: number, n: number, from: number, to: number) => {
      const excess = (p: number) => Math.abs(x / n - p) / Math.sqrt((p * (1 - p)) / n) - z; // > 0 outside the interval
      let [a, b] = [from, to];
      for (let i = 0; i < 200; i++) {
        const m = (a + b) / 2;
        if ((excess(m) > 0) === (excess(a) > 0)) a = m;
        else b = m;
      }
      return (a + b) / 2;
    };
    for (const [x, n] of [[81, 263], [15, 148], [1, 29], [7, 12], [149, 240], [4999, 5000], [50, 100]]) {
      const p = x / n;
      const [low, high] = wilsonInterval(x, n)!;
      expect(low).toBeCloseTo(root(x, n, 1e-15, p), 10);
      expect(high).toBeCloseTo(root(x, n, p, 1 - 1e-15), 10);
    }
  });

  test('the limits have 2.5 % in each tail of the normal approximation at that p', () => {
    const [x, n] = [60, 100];
    const [low, high] = wilsonInterval(x, n)!;
    const tail = (p: number) => normalCdf(-Math.abs(x / n - p) / Math.sqrt((p * (1 - p)) / n));
    expect(tail(low)).toBeCloseTo(0.025, 12);
    expect(tail(high)).toBeCloseTo(0.025, 12);
  });

  test('no snaps → null; bad counts throw', () => {
    expect(wilsonInterval(0, 0)).toBeNull();
    expect(() => wilsonInterval(5, 4)).toThrow(RangeError);
    expect(() => wilsonInterval(-1, 4)).toThrow(RangeError);
    expect(() => wilsonInterval(1.5, 4)).toThrow(RangeError);
  });

  test('a wider z gives a wider interval', () => {
    const [l95, h95] = wilsonInterval(30, 50)!;
    const [l99, h99] = wilsonInterval(30, 50, 2.5758293035489004)!;
    expect(l99).toBeLessThan(l95);
    expect(h99).toBeGreaterThan(h95);
  });

  test('property: contains p̂, lies in [0, 1], low ≤ high', () => {
    fc.assert(
      fc.property(counts, ([x, n]) => {
        const [low, high] = wilsonInterval(x, n)!;
        return low >= 0 && high <= 1 && low <= x / n + 1e-15 && x / n <= high + 1e-15 && low < high;
      }),
    );
  });

  test('property: symmetric under plus ↔ minus', () => {
    fc.assert(
      fc.property(counts, ([x, n]) => {
        const [low, high] = wilsonInterval(x, n)!;
        const [mLow, mHigh] = wilsonInterval(n - x, n)!;
        return Math.abs(low - (1 - mHigh)) < 1e-12 && Math.abs(high - (1 - mLow)) < 1e-12;
      }),
    );
  });

  test('rateWithInterval bundles counts, rate and interval', () => {
    expect(rateWithInterval(81, 182)).toEqual({ plus: 81, minus: 182, snaps: 263, rate: 81 / 263, interval: wilsonInterval(81, 263) });
    expect(rateWithInterval(0, 0)).toEqual({ plus: 0, minus: 0, snaps: 0, rate: null, interval: null });
    expect(Z95).toBe(1.959963984540054);
  });
});
