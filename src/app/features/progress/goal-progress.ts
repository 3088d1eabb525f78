import type { Goal, RateShape } from './development-types';
import { formatRate, snapsText } from './rate-text';

export interface GoalProgress {
  state: 'achieved' | 'on-target' | 'short' | 'no-data';
  /** Word first, so the state never rests on the icon or the colour. */
  label: string;
  icon: string;
  /** "Now 78 % of 120 snaps, target 85 %: 7 points to go". */
  detail: string;
  /** 0–100 for the meter: current as a share of the target. */
  meter: number;
}

/**
 * Where a goal stands. A coach marks a goal achieved; until then the page says whether the season
 * rate is at the target now, and how far off it is, always with the snaps behind the rate.
 */
export function goalProgress(goal: Goal, current: RateShape | undefined): GoalProgress {
  const target = formatRate(goal.target);
  const rate = current?.rate ?? goal.current;
  const snaps = current ? ` of ${snapsText(current.snaps)}` : '';
  const meter = rate === null ? 0 : Math.max(0, Math.min(100, Math.round((rate / goal.target) * 100)));
  if (goal.achievedAt !== null) {
    return { state: 'achieved', label: 'Achieved', icon: 'verified', detail: `Marked achieved; now ${formatRate(rate)}${snaps}, target ${target}`, meter };
  }
  if (rate === null) return { state: 'no-data', label: 'No graded snaps yet', icon: 'hourglass_empty', detail: `Target ${target}`, meter: 0 };
  if (rate >= goal.target) return { state: 'on-target', label: 'On target now', icon: 'check_circle', detail: `Now ${formatRate(rate)}${snaps}, target ${target}`, meter };
  const gap = Math.round((goal.target - rate) * 100);
  return { state: 'short', label: 'Not there yet', icon: 'flag', detail: `Now ${formatRate(rate)}${snaps}, target ${target}: ${gap} ${gap === 1 ? 'point' : 'points'} to go`, meter };
}
