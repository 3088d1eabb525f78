import { assertCount, type PlusMinus } from './counts';
import { rateWithInterval, type RateWithInterval } from './wilson';

const DAY_MS = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Days since 1970-01-01 of a calendar date 'YYYY-MM-DD' (the session's local date; no time zone). */
function dayNumber(date: string): number {
  const m = ISO_DATE.exec(date);
  const ms = m ? Date.UTC(+m[1], +m[2] - 1, +m[3]) : NaN;
  // Date.UTC rolls 2025-02-30 over to March: the round trip catches days and months out of range.
  if (!m || Number.isNaN(ms) || new Date(ms).toISOString().slice(0, 10) !== date) throw new RangeError(`not a calendar date YYYY-MM-DD: ${date}`);
  return ms / DAY_MS;
}

/** The Monday that starts the date's week (ISO 8601 weeks), as 'YYYY-MM-DD'. */
export function weekStart(date: string): string {
  const day = dayNumber(date);
  const weekday = (new Date(day * DAY_MS).getUTCDay() + 6) % 7; // Monday 0 … Sunday 6
  return new Date((day - weekday) * DAY_MS).toISOString().slice(0, 10);
}

/** Whole weeks from one Monday to another (negative when `to` is earlier). */
export function weeksBetween(fromWeekStart: string, toWeekStart: string): number {
  return Math.round((dayNumber(toWeekStart) - dayNumber(fromWeekStart)) / 7);
}

export interface DatedTally extends PlusMinus {
  /** Session date 'YYYY-MM-DD'. */
  date: string;
}

export interface WeekTally extends RateWithInterval {
  weekStart: string;
}

/** Each session's rate with its 95 % Wilson interval, oldest first (stable for same-day sessions). */
export function tallyBySession<T extends DatedTally>(sessions: readonly T[]): (T & RateWithInterval)[] {
  return sessions
    .map((s, order) => ({ s, order, day: dayNumber(s.date) }))
    .sort((a, b) => a.day - b.day || a.order - b.order)
    .map(({ s }) => ({ ...s, ...rateWithInterval(s.plus, s.minus) }));
}

/**
 * Pools session tallies into weeks (Monday to Sunday), oldest first. A week's rate is its plus
 * snaps over its graded snaps, so a 70-snap game outweighs a 10-snap practice period.
 */
export function tallyByWeek(sessions: readonly DatedTally[]): WeekTally[] {
  const weeks = new Map<string, { plus: number; minus: number }>();
  for (const s of sessions) {
    assertCount(s.plus, 'plus');
    assertCount(s.minus, 'minus');
    const key = weekStart(s.date);
    const week = weeks.get(key) ?? { plus: 0, minus: 0 };
    week.plus += s.plus;
    week.minus += s.minus;
    weeks.set(key, week);
  }
  return [...weeks.entries()]
    .sort(([a], [b]) => (a < b ? -1 : 1))
    .map(([key, { plus, minus }]) => ({ weekStart: key, ...rateWithInterval(plus, minus) }));
}
