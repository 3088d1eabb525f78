/**
 * Typed handles on the reference libraries the specs check against (devDependencies, tests only:
 * never import this from runtime code). jstat and wilson-score-interval ship no type declarations;
 * @stdlib/stats-chi2test ships its own (docs/types).
 */
import chi2test = require('@stdlib/stats-chi2test');
export { chi2test };
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { jStat } = require('jstat') as { jStat: JStat };
export { jStat };
export { linearRegression } from 'simple-statistics';
// wilson-score-interval 2.1.0: (positives, total) → { left, right }, the Wilson score interval
// without continuity correction at z = 1.96 (fixed in its index.js).
// eslint-disable-next-line @typescript-eslint/no-require-imports
export const wilsonScoreInterval = require('wilson-score-interval') as (positive: number, total: number) => { left: number; right: number };

export interface JStat {
  normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
  beta: { pdf(x: number, a: number, b: number): number; mean(a: number, b: number): number; variance(a: number, b: number): number };
  studentt: { cdf(x: number, df: number): number; inv(p: number, df: number): number };
  chisquare: { cdf(x: number, df: number): number };
  ibeta(x: number, a: number, b: number): number;
  gammaln(x: number): number;
  erfc(x: number): number;
  models: { ols(endog: number[], exog: number[][]): { coef: number[]; t: { se: number[] } } };
}
