import type { Interval, TrendReading } from '@shared/stats';
import { TREND_RULE } from '@shared/stats';

/** 0.794 → "79 %"; null (nothing graded) → "—". */
export function formatRate(rate: number | null | undefined): string {
  return rate === null || rate === undefined ? '—' : `${Math.round(rate * 100)} %`;
}

/** [0.641, 0.792] → "64–79 %"; null → "—". */
export function formatInterval(interval: Interval | readonly [number, number] | null | undefined): string {
  if (!interval) return '—';
  return `${Math.round(interval[0] * 100)}–${Math.round(interval[1] * 100)} %`;
}

/** 1 → "1 snap", 12 → "12 snaps": every number a coach reads comes with its sample size. */
export function snapsText(snaps: number, noun = 'snap'): string {
  return `${snaps} ${snaps === 1 ? noun : `${noun}s`}`;
}

/** "79 % of 58 snaps (95 % interval 68–87 %)". */
export function rateSentence(r: { rate: number | null; snaps: number; interval: Interval | readonly [number, number] | null }): string {
  if (r.rate === null || r.snaps === 0) return 'no graded snaps';
  return `${formatRate(r.rate)} of ${snapsText(r.snaps)} (95 % interval ${formatInterval(r.interval)})`;
}

/** A weekly slope as points: 0.014 → "+1.4 points a week". */
export function formatSlope(slope: number | null): string {
  if (slope === null) return '—';
  const points = slope * 100;
  const sign = points > 0.05 ? '+' : points < -0.05 ? '−' : '±';
  return `${sign}${Math.abs(points).toFixed(1)} points a week`;
}

/** The slope interval in points: [-0.002, 0.03] → "−0.2 to +3.0". */
export function formatSlopeInterval(interval: Interval | readonly [number, number] | null): string {
  if (!interval) return '—';
  const one = (v: number) => `${v < 0 ? '−' : v > 0 ? '+' : ''}${Math.abs(v * 100).toFixed(1)}`;
  return `${one(interval[0])} to ${one(interval[1])}`;
}

export interface ReadingView {
  word: TrendReading;
  /** A Material icon name; shown beside the word, never instead of it. */
  icon: string;
  tone: 'up' | 'flat' | 'down' | 'unknown';
}

const READINGS: Record<TrendReading, ReadingView> = {
  improving: { word: 'improving', icon: 'trending_up', tone: 'up' },
  flat: { word: 'flat', icon: 'trending_flat', tone: 'flat' },
  slipping: { word: 'slipping', icon: 'trending_down', tone: 'down' },
  'not enough data yet': { word: 'not enough data yet', icon: 'hourglass_empty', tone: 'unknown' },
};

export function readingView(reading: TrendReading): ReadingView {
  return READINGS[reading] ?? READINGS['not enough data yet'];
}

/** How the reading is decided, in words, from the shared rule so the page never drifts from the API. */
export function trendRuleText(): string {
  const band = (TREND_RULE.flatBand * 100).toFixed(0);
  return (
    `A straight line through the weekly plus rates. "Improving" or "slipping" only when the slope's ` +
    `${Math.round(TREND_RULE.confidence * 100)} % interval lies wholly above or below zero; "flat" when it lies within ±${band} point a week; ` +
    `anything else, or fewer than ${TREND_RULE.minWeeks} graded weeks, is "not enough data yet".`
  );
}

const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "2026-09-05" → "Sat 5 Sep": short, unambiguous, the same in every browser and in the tests. */
export function shortDate(isoDate: string): string {
  const [y, m, d] = isoDate.slice(0, 10).split('-').map(Number);
  const date = new Date(Date.UTC(y, m - 1, d));
  return `${WEEKDAYS[date.getUTCDay()]} ${d} ${MONTHS[m - 1]}`;
}

/** A chart tick: "5 Sep". */
export function dayMonth(date: Date): string {
  return `${date.getUTCDate()} ${MONTHS[date.getUTCMonth()]}`;
}

/** A YYYY-MM-DD date as a Date at midnight UTC, for time scales. */
export function dateValue(isoDate: string): Date {
  const [y, m, d] = isoDate.slice(0, 10).split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d));
}
