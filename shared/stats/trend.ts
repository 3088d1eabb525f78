import { fitLine, type LineFit } from './least-squares';
import { studentTCritical } from './student-t';
import { weeksBetween, type WeekTally } from './series';

export type TrendReading = 'improving' | 'flat' | 'slipping' | 'not enough data yet';

/**
 * Thresholds of the trend reading (our choice):
 * - `minWeeks` 4: a line through 2–3 weekly rates is mostly noise (a 60-snap week alone swings
 *   about ±12 points at 95 %), and with 4 points the slope's interval still has 2 degrees of freedom.
 * - `confidence` 0.95, Student-t with n − 2 degrees of freedom: with 4–8 weeks a plain "|slope/SE| ≥ 2"
 *   would call a trend that has 1 chance in 5 or 6 of being noise (t₀.₉₇₅ is 4.30 at 2 df).
 * - `flatBand` 0.01 per week: less than 1 point a week is under 12 points over a season, too
 *   small for a coach to act on; "flat" is said only when the whole interval lies inside ±1 point.
 */
export const TREND_RULE = { minWeeks: 4, confidence: 0.95, flatBand: 0.01 } as const;

export interface TrendFit {
  /** Weeks with graded snaps that went into the line. */
  weeks: number;
  /** Change of the plus rate per week (fraction: 0.01 = 1 point a week); null below 2 weeks. */
  slope: number | null;
  intercept: number | null;
  slopeStandardError: number | null;
  /** 95 % t interval of the slope; null below 3 weeks. */
  slopeInterval: [number, number] | null;
  reading: TrendReading;
}

/**
 * The reading rule alone: 'flat' when the slope's interval lies inside ±flatBand; else 'improving' or
 * 'slipping' when it lies wholly above or below 0; else (and below minWeeks) 'not enough data yet'.
 * Flat is tested first so a tiny but steady drift reads as flat, not as a trend to act on.
 */
export function readTrend(weeks: number, slopeInterval: readonly [number, number] | null, rule = TREND_RULE): TrendReading {
  if (weeks < rule.minWeeks || slopeInterval === null) return 'not enough data yet';
  const [low, high] = slopeInterval;
  if (low >= -rule.flatBand && high <= rule.flatBand) return 'flat';
  if (low > 0) return 'improving';
  if (high < 0) return 'slipping';
  return 'not enough data yet';
}

/** Interval slope ± t·SE of a fitted line at the rule's confidence; null without a standard error. */
export function slopeInterval(fit: LineFit, confidence: number = TREND_RULE.confidence): [number, number] | null {
  if (fit.slopeStandardError === null) return null;
  const half = studentTCritical(confidence, fit.degreesOfFreedom) * fit.slopeStandardError;
  return [fit.slope - half, fit.slope + half];
}

/**
 * Least-squares line of the weekly plus rate against the week number (weeks counted from the first
 * graded week, so an off week leaves a gap rather than closing up), and its reading. Each week is
 * one point, whatever its snap count; weeks with no graded snaps are left out.
 */
export function weeklyTrend(weeks: readonly WeekTally[], rule = TREND_RULE): TrendFit {
  const graded = weeks.filter((w) => w.plus + w.minus > 0);
  const points = graded.map((w) => [weeksBetween(graded[0].weekStart, w.weekStart), w.plus / (w.plus + w.minus)] as [number, number]);
  const fit = fitLine(points);
  if (fit === null) return { weeks: graded.length, slope: null, intercept: null, slopeStandardError: null, slopeInterval: null, reading: 'not enough data yet' };
  const interval = slopeInterval(fit, rule.confidence);
  return {
    weeks: graded.length,
    slope: fit.slope,
    intercept: fit.intercept,
    slopeStandardError: fit.slopeStandardError,
    slopeInterval: interval,
    reading: readTrend(graded.length, interval, rule),
  };
}
