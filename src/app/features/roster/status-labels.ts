import type { PlayerStatus } from '@shared/roster';

/** Status is always shown as a word with an icon; colour only repeats it. */
export const STATUS_LABELS: Record<PlayerStatus, string> = {
  active: 'Active',
  injured: 'Injured',
  inactive: 'Inactive',
};

export const STATUS_ICONS: Record<PlayerStatus, string> = {
  active: 'check_circle',
  injured: 'healing',
  inactive: 'pause_circle',
};
