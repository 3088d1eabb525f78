/**
 * Trenchwork's statistics: pure functions on plain numbers (rates are fractions 0–1, intervals
 * [low, high]), shared by the server and the client. No runtime dependencies.
 */
export { Z95, erfc, normalCdf, twoSidedP } from './normal';
export { wilsonInterval, rateWithInterval, type Interval, type RateWithInterval } from './wilson';
export { twoProportionZTest, type TwoProportionTest } from './two-proportion';
export { probabilityBetaExceeds, probabilityRateHigher } from './beta-compare';
export {
  compareCandidates,
  comparePair,
  formatProbability,
  MIN_SNAPS_TO_COMPARE,
  TOO_FEW_SNAPS,
  type Candidate,
  type CandidateComparison,
  type CandidateSummary,
  type PairComparison,
} from './candidate-comparison';
export { cohensKappa, kappaByComponent, type ComponentGradePair, type KappaResult } from './kappa';
export { fitLine, type LineFit } from './least-squares';
export { studentTCentral, studentTCritical } from './student-t';
export { readTrend, slopeInterval, weeklyTrend, TREND_RULE, type TrendFit, type TrendReading } from './trend';
export { rollingAverage, rollingPlusRate } from './rolling';
export { tallyBySession, tallyByWeek, weekStart, weeksBetween, type DatedTally, type WeekTally } from './series';
export {
  linemanResults,
  resultScores,
  unitGrade,
  unitSnapOutcome,
  weakestLink,
  weakestLinkCounts,
  type AllPlusShare,
  type LinemanResult,
  type LinemanScore,
  type UnitSnapCounts,
  type UnitSnapOutcome,
  type WeakestLink,
} from './unit-grade';
export { logGamma, logBeta } from './log-gamma';
export type { PlusMinus } from './counts';
