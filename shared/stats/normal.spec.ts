import { erfc, normalCdf, twoSidedP, Z95 } from './normal';
import { jStat } from './reference-libraries.testing';

describe('erfc and Φ', () => {
  // Tabulated values of erfc, quoted FROM MEMORY (not checked against a printed table).
  test.each([
    [1, 0.15729920705028513],
    [2, 0.004677734981047266],
    [5, 1.5374597944280349e-12],
  ])('erfc(%d) against its tabulated value (from memory)', (x, expected) => {
    expect(Math.abs(erfc(x) - expected) / expected).toBeLessThan(1e-12);
  });

  test('agrees with jStat.erfc and jStat.normal.cdf (jstat 1.9.6) where jStat is accurate', () => {
    for (let x = -4; x <= 4; x += 0.125) {
      expect(erfc(x)).toBeCloseTo(jStat.erfc(x), 14);
      expect(normalCdf(x)).toBeCloseTo(jStat.normal.cdf(x, 0, 1), 14);
    }
  });

  test('Z95 is the 0.975 quantile: Φ(Z95) = 0.975, and jStat.normal.inv(0.975) agrees', () => {
    expect(normalCdf(Z95)).toBeCloseTo(0.975, 15);
    expect(jStat.normal.inv(0.975, 0, 1)).toBeCloseTo(Z95, 12);
    expect(twoSidedP(Z95)).toBeCloseTo(0.05, 15);
  });

  test('the tail keeps relative accuracy where 1 − Φ would round to 0', () => {
    // erfc(x) ~ e^(−x²)/(x√π)·(1 − 1/(2x²) + 3/(4x⁴)) for large x (asymptotic series).
    const x = 10;
    const asymptotic = (Math.exp(-x * x) / (x * Math.sqrt(Math.PI))) * (1 - 1 / (2 * x * x) + 3 / (4 * x ** 4) - 15 / (8 * x ** 6));
    expect(Math.abs(erfc(x) - asymptotic) / asymptotic).toBeLessThan(1e-6);
    expect(erfc(-x)).toBe(2);
    expect(Number.isNaN(erfc(NaN))).toBe(true);
  });
});
