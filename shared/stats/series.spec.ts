import { tallyBySession, tallyByWeek, weekStart, weeksBetween } from './series';
import { wilsonInterval } from './wilson';

describe('weekStart', () => {
  test('Monday of the ISO week, across month and year ends', () => {
    // Calendar facts: 2025-09-01 was a Monday, 2025-09-07 a Sunday, 2026-01-01 a Thursday.
    expect(weekStart('2025-09-01')).toBe('2025-09-01');
    expect(weekStart('2025-09-07')).toBe('2025-09-01');
    expect(weekStart('2025-09-08')).toBe('2025-09-08');
    expect(weekStart('2026-01-01')).toBe('2025-12-29');
    expect(weekStart('2024-03-01')).toBe('2024-02-26'); // leap year
  });

  test('rejects anything but a real calendar date', () => {
    for (const bad of ['2025-02-30', '2025-13-01', '2025-9-1', '2025-09-01T10:00:00Z', '']) expect(() => weekStart(bad)).toThrow(RangeError);
  });

  test('weeksBetween counts whole weeks, gaps included', () => {
    expect(weeksBetween('2025-09-01', '2025-09-22')).toBe(3);
    expect(weeksBetween('2025-09-22', '2025-09-01')).toBe(-3);
    expect(weeksBetween('2025-10-20', '2025-11-03')).toBe(2); // across the end of daylight saving in many zones: dates carry no zone
  });
});

describe('tallyByWeek and tallyBySession', () => {
  const sessions = [
    { id: 'game 2', date: '2025-09-13', plus: 40, minus: 20 },
    { id: 'practice', date: '2025-09-02', plus: 8, minus: 2 },
    { id: 'game 1', date: '2025-09-06', plus: 45, minus: 25 },
    { id: 'walkthrough', date: '2025-09-09', plus: 0, minus: 0 },
  ];

  test('weeks pool their sessions\' snaps, oldest first, with Wilson intervals', () => {
    expect(tallyByWeek(sessions)).toEqual([
      { weekStart: '2025-09-01', plus: 53, minus: 27, snaps: 80, rate: 53 / 80, interval: wilsonInterval(53, 80) },
      { weekStart: '2025-09-08', plus: 40, minus: 20, snaps: 60, rate: 40 / 60, interval: wilsonInterval(40, 60) },
    ]);
  });

  test('sessions sorted by date, keeping their own fields, a session without grades has no rate', () => {
    const series = tallyBySession(sessions);
    expect(series.map((s) => s.id)).toEqual(['practice', 'game 1', 'walkthrough', 'game 2']);
    expect(series[2]).toMatchObject({ id: 'walkthrough', rate: null, interval: null });
    expect(series[0]).toMatchObject({ snaps: 10, rate: 0.8 });
  });

  test('bad counts throw', () => {
    expect(() => tallyByWeek([{ date: '2025-09-01', plus: 1.5, minus: 0 }])).toThrow(RangeError);
  });
});
