import { logBeta, logGamma } from './log-gamma';
import { jStat } from './reference-libraries.testing';

describe('logGamma', () => {
  test('matches ln((n − 1)!) summed exactly and jStat.gammaln (jstat 1.9.6)', () => {
    let logFactorial = 0; // ln((n − 1)!)
    for (let n = 1; n <= 6000; n++) {
      if (n > 1) logFactorial += Math.log(n - 1);
      if (n % 37 === 1 || n < 20) {
        expect(Math.abs(logGamma(n) - logFactorial)).toBeLessThan(1e-10 * Math.max(1, logFactorial));
        expect(logGamma(n)).toBeCloseTo(jStat.gammaln(n), 8);
      }
    }
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 14); // Γ(½) = √π
    expect(logGamma(0.25)).toBeCloseTo(jStat.gammaln(0.25), 12);
  });
});

describe('logBeta', () => {
  test('B(2, 3) = 1/12 and B(a, b) = B(b, a)', () => {
    expect(Math.exp(logBeta(2, 3))).toBeCloseTo(1 / 12, 15);
    expect(logBeta(130.5, 7)).toBeCloseTo(logBeta(7, 130.5), 12);
    expect(() => logGamma(0)).toThrow(RangeError);
  });
});
