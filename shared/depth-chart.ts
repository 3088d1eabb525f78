/**
 * Depth charts by week. A chart saved for week W is in force from week W on, until a later week's
 * chart replaces it; week 0 is the base (preseason) chart. A session without a week (a scrimmage
 * nobody numbered) is graded against the current chart, the latest one saved.
 */

/** The saved week whose chart is in force at `week` (null: the latest), or null when none is. */
export function chartWeekInForce(savedWeeks: readonly number[], week: number | null | undefined): number | null {
  let found: number | null = null;
  for (const saved of savedWeeks) {
    if ((week === null || week === undefined || saved <= week) && (found === null || saved > found)) found = saved;
  }
  return found;
}

/** The weeks a chart saved for `week` governs: up to the next saved week, or open-ended ("from week 2 on"). */
export function weeksGoverned(savedWeeks: readonly number[], week: number): { from: number; through: number | null } {
  const later = savedWeeks.filter((w) => w > week);
  return { from: week, through: later.length > 0 ? Math.min(...later) - 1 : null };
}

/** "Week 0 (base)", "Week 4". */
export function chartWeekLabel(week: number): string {
  return week === 0 ? 'Week 0 (base)' : `Week ${week}`;
}
