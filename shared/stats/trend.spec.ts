import { fitLine } from './least-squares';
import { jStat, linearRegression } from './reference-libraries.testing';
import { readTrend, slopeInterval, TREND_RULE, weeklyTrend } from './trend';
import type { WeekTally } from './series';

describe('readTrend (the rule alone)', () => {
  test.each([
    [3, [0.02, 0.05], 'not enough data yet'],
    [4, null, 'not enough data yet'],
    [4, [0.004, 0.05], 'improving'],
    [4, [-0.05, -0.02], 'slipping'],
    [8, [-0.008, 0.009], 'flat'],
    [8, [0.001, 0.009], 'flat'], // steady but under a point a week: nothing to act on
    [8, [-0.03, 0.02], 'not enough data yet'],
    [6, [-0.005, 0.03], 'not enough data yet'], // mostly up, but 0 is inside: no call
    [6, [-0.03, 0.005], 'not enough data yet'],
    [8, [-0.01, 0.01], 'flat'],
  ] as const)('%d weeks, interval %j → %s', (weeks, interval, reading) => {
    expect(readTrend(weeks, interval)).toBe(reading);
  });

  test('thresholds are documented values', () => {
    expect(TREND_RULE).toEqual({ minWeeks: 4, confidence: 0.95, flatBand: 0.01 });
  });
});

const week = (weekStart: string, plus: number, minus: number): WeekTally => ({
  weekStart, plus, minus, snaps: plus + minus, rate: plus / (plus + minus), interval: null,
});

describe('weeklyTrend', () => {
  test('a steady climb of 4 points a week over 6 weeks reads improving', () => {
    const weeks = [week('2025-09-01', 30, 30), week('2025-09-08', 33, 27), week('2025-09-15', 36, 24), week('2025-09-22', 38, 22), week('2025-09-29', 40, 20), week('2025-10-06', 42, 18)];
    const trend = weeklyTrend(weeks);
    const reference = linearRegression(weeks.map((w, i) => [i, w.rate!]));
    expect(trend.slope).toBeCloseTo(reference.m, 14);
    expect(trend.reading).toBe('improving');
    expect(trend.slopeInterval![0]).toBeGreaterThan(0);
  });

  test('a slide reads slipping; the same slide over 3 weeks is not enough data', () => {
    const weeks = [week('2025-09-01', 48, 12), week('2025-09-08', 45, 15), week('2025-09-15', 41, 19), week('2025-09-22', 39, 21), week('2025-09-29', 35, 25)];
    expect(weeklyTrend(weeks).reading).toBe('slipping');
    expect(weeklyTrend(weeks.slice(0, 3)).reading).toBe('not enough data yet');
  });

  test('an off week leaves a gap in x rather than closing up', () => {
    const weeks = [week('2025-09-01', 30, 30), week('2025-09-08', 36, 24), week('2025-09-22', 48, 12), week('2025-09-29', 54, 6)];
    const trend = weeklyTrend(weeks);
    // Rates 0.5, 0.6, 0.8, 0.9 at weeks 0, 1, 3, 4: an exact line of 0.1 a week.
    expect(trend.slope).toBeCloseTo(0.1, 14);
    expect(trend.slope).toBeCloseTo(linearRegression([[0, 0.5], [1, 0.6], [3, 0.8], [4, 0.9]]).m, 14);
    expect(trend.slopeStandardError).toBeCloseTo(0, 12);
    expect(trend.reading).toBe('improving');
  });

  test('noisy weeks around a level read "not enough data yet"; a long, tight level reads flat', () => {
    const noisy = [week('2025-09-01', 40, 20), week('2025-09-08', 30, 30), week('2025-09-15', 44, 16), week('2025-09-22', 33, 27)];
    expect(weeklyTrend(noisy).reading).toBe('not enough data yet');
    const level = Array.from({ length: 12 }, (_, i) => week(new Date(Date.UTC(2025, 7, 4 + 7 * i)).toISOString().slice(0, 10), 45 + (i % 2), 15 - (i % 2)));
    expect(weeklyTrend(level).reading).toBe('flat');
  });

  test('weeks without graded snaps are skipped; under 2 weeks → no line', () => {
    const empty: WeekTally = { weekStart: '2025-09-08', plus: 0, minus: 0, snaps: 0, rate: null, interval: null };
    expect(weeklyTrend([week('2025-09-01', 30, 30), empty])).toMatchObject({ weeks: 1, slope: null, reading: 'not enough data yet' });
    expect(weeklyTrend([])).toMatchObject({ weeks: 0, slope: null, reading: 'not enough data yet' });
  });

  test('slopeInterval uses t with n − 2 df', () => {
    const fit = fitLine([[0, 0.5], [1, 0.62], [2, 0.58], [3, 0.7]])!;
    const [low, high] = slopeInterval(fit)!;
    expect((high - low) / 2).toBeCloseTo(jStat.studentt.inv(0.975, 2) * fit.slopeStandardError!, 8);
  });
});
