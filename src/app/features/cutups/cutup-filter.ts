import type { Angle } from '@shared/film';
import type { CutupFilterInput } from './cutups-api';

export const FILTER_COMPONENTS = ['assignment', 'footwork', 'hands', 'padLevel', 'effort'] as const;
export type FilterComponent = (typeof FILTER_COMPONENTS)[number];

/** The filter form's raw value. Empty means "any". */
export interface FilterFormValue {
  sessionIds: number[];
  conceptIds: number[];
  frontIds: number[];
  playerId: number | null;
  component: FilterComponent | '';
  mark: 'plus' | 'minus';
  angle: Angle | '';
}

export const EMPTY_FILTER: FilterFormValue = { sessionIds: [], conceptIds: [], frontIds: [], playerId: null, component: '', mark: 'minus', angle: '' };

/**
 * The API filter for a form value: only what is set. A grade part (and its plus or minus) only
 * means something for one player, so it goes only with a player.
 */
export function filterFrom(value: FilterFormValue): CutupFilterInput {
  const filter: CutupFilterInput = {};
  if (value.sessionIds.length) filter.sessionIds = [...value.sessionIds];
  if (value.conceptIds.length) filter.conceptIds = [...value.conceptIds];
  if (value.frontIds.length) filter.frontIds = [...value.frontIds];
  if (value.playerId !== null) {
    filter.playerId = value.playerId;
    if (value.component) {
      filter.component = value.component;
      filter.mark = value.mark;
    }
  }
  if (value.angle) filter.angle = value.angle;
  return filter;
}

/** Angle alone would list the whole season; ask for something that narrows it first. */
export function narrowsEnough(filter: CutupFilterInput): boolean {
  return Boolean(filter.sessionIds || filter.conceptIds || filter.frontIds || filter.playerId !== undefined);
}

export function sameFilter(a: CutupFilterInput, b: CutupFilterInput): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}
