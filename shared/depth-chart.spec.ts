import { chartWeekInForce, chartWeekLabel, weeksGoverned } from './depth-chart';

describe('chartWeekInForce', () => {
  // Charts saved for the base week, week 4 and week 7 (listed out of order on purpose).
  const saved = [4, 0, 7];

  it('carries the greatest saved week at or before the week asked', () => {
    expect(chartWeekInForce(saved, 0)).toBe(0);
    expect(chartWeekInForce(saved, 2)).toBe(0);
    expect(chartWeekInForce(saved, 3)).toBe(0);
    expect(chartWeekInForce(saved, 4)).toBe(4);
    expect(chartWeekInForce(saved, 6)).toBe(4);
    expect(chartWeekInForce(saved, 7)).toBe(7);
    expect(chartWeekInForce(saved, 15)).toBe(7);
  });

  it('answers the latest chart for a session without a week', () => {
    expect(chartWeekInForce(saved, null)).toBe(7);
    expect(chartWeekInForce(saved, undefined)).toBe(7);
  });

  it('has nothing in force before the first saved week, or when nothing is saved', () => {
    expect(chartWeekInForce([3], 2)).toBeNull();
    expect(chartWeekInForce([], 5)).toBeNull();
    expect(chartWeekInForce([], null)).toBeNull();
  });
});

describe('weeksGoverned', () => {
  it('runs to the week before the next saved chart, or stays open', () => {
    expect(weeksGoverned([0, 4, 7], 0)).toEqual({ from: 0, through: 3 });
    expect(weeksGoverned([0, 4, 7], 4)).toEqual({ from: 4, through: 6 });
    expect(weeksGoverned([0, 4, 7], 7)).toEqual({ from: 7, through: null });
    // A week not yet saved: a chart saved there would run until week 4's.
    expect(weeksGoverned([0, 4], 2)).toEqual({ from: 2, through: 3 });
  });
});

describe('chartWeekLabel', () => {
  it('names the base week', () => {
    expect(chartWeekLabel(0)).toBe('Week 0 (base)');
    expect(chartWeekLabel(5)).toBe('Week 5');
  });
});
