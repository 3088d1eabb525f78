import type { RowSaveState } from './grade-save-queue';

/** Each save state as an icon and words; colour only repeats them. */
export const SAVE_STATE_VIEW: Record<RowSaveState, { icon: string; label: string }> = {
  empty: { icon: 'radio_button_unchecked', label: 'Not graded' },
  saved: { icon: 'cloud_done', label: 'Saved' },
  unsaved: { icon: 'edit', label: 'Unsaved' },
  saving: { icon: 'sync', label: 'Saving…' },
  offline: { icon: 'cloud_off', label: 'Waiting: offline' },
  conflict: { icon: 'call_split', label: 'Conflict: choose' },
  failed: { icon: 'error', label: 'Not saved' },
  locked: { icon: 'lock', label: 'Waiting: locked' },
};
