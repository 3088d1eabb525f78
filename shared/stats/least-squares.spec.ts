import fc from 'fast-check';
import { fitLine } from './least-squares';
import { jStat, linearRegression } from './reference-libraries.testing';

describe('fitLine', () => {
  test('slope and intercept match simple-statistics linearRegression (simple-statistics 7.12.1)', () => {
    const points: [number, number][] = [[0, 0.62], [1, 0.58], [2, 0.7], [3, 0.66], [5, 0.74], [6, 0.71]];
    const fit = fitLine(points)!;
    const reference = linearRegression(points);
    expect(fit.slope).toBeCloseTo(reference.m, 14);
    expect(fit.intercept).toBeCloseTo(reference.b, 14);
  });

  test('slope standard error matches jStat.models.ols (jstat 1.9.6)', () => {
    const points: [number, number][] = [[0, 0.62], [1, 0.58], [2, 0.7], [3, 0.66], [5, 0.74], [6, 0.71]];
    const ols = jStat.models.ols(points.map(([, y]) => y), points.map(([x]) => [1, x]));
    const fit = fitLine(points)!;
    expect(fit.slope).toBeCloseTo(ols.coef[1], 12);
    expect(fit.slopeStandardError!).toBeCloseTo(ols.t.se[1], 12);
    expect(fit.degreesOfFreedom).toBe(4);
  });

  test('property: agrees with simple-statistics on random data', () => {
    const point = fc.tuple(fc.integer({ min: 0, max: 40 }), fc.double({ min: 0, max: 1, noNaN: true }));
    fc.assert(
      fc.property(fc.array(point, { minLength: 2, maxLength: 30 }), (points) => {
        const fit = fitLine(points);
        if (new Set(points.map(([x]) => x)).size === 1) return fit === null;
        const reference = linearRegression(points);
        return Math.abs(fit!.slope - reference.m) < 1e-9 && Math.abs(fit!.intercept - reference.b) < 1e-9;
      }),
    );
  });

  test('too few points or one x only → null; two points → slope without standard error', () => {
    expect(fitLine([])).toBeNull();
    expect(fitLine([[1, 0.5]])).toBeNull();
    expect(fitLine([[2, 0.5], [2, 0.7]])).toBeNull();
    expect(fitLine([[0, 0.5], [2, 0.7]])).toMatchObject({ slope: 0.09999999999999998, slopeStandardError: null });
  });
});
