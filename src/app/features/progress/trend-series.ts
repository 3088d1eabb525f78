import type { Interval } from '@shared/stats';
import { dateValue } from './rate-text';

/** One session on a trend: its own rate with interval, and the rolling rate up to it. */
export interface TrendPoint {
  sessionId: number;
  date: string;
  title?: string;
  snaps: number;
  plus: number;
  rate: number | null;
  interval: Interval | null;
  rolling: number | null;
}

export interface ChartPoint {
  name: Date;
  value: number;
  min?: number;
  max?: number;
  snaps: number;
}

export interface ChartSeries {
  name: string;
  series: ChartPoint[];
}

export const SESSION_SERIES = 'Session plus rate';
/** The API pools the last three sessions (server/development ROLLING_WINDOW); it does not send the number. */
export const ROLLING_SERIES = 'Rolling rate, last 3 sessions';

/**
 * The line chart's series: each session's rate with its 95 % interval as the shaded band, and the
 * rolling rate. Sessions without a graded snap (or before the rolling window fills) are left out
 * rather than drawn at zero.
 */
export function trendSeries(points: readonly TrendPoint[]): ChartSeries[] {
  const sessions: ChartPoint[] = points
    .filter((p) => p.rate !== null && p.snaps > 0)
    .map((p) => ({ name: dateValue(p.date), value: p.rate!, snaps: p.snaps, ...(p.interval ? { min: p.interval[0], max: p.interval[1] } : {}) }));
  const rolling: ChartPoint[] = points.filter((p) => p.rolling !== null).map((p) => ({ name: dateValue(p.date), value: p.rolling!, snaps: p.snaps }));
  const out: ChartSeries[] = [{ name: SESSION_SERIES, series: sessions }];
  if (rolling.length > 0) out.push({ name: ROLLING_SERIES, series: rolling });
  return out;
}
