import type { ShortcutGroup } from '../snap-player/shortcut-keys';

/** The coaching-point keys, beside the player's own. */
export const POINT_SHORTCUTS: ShortcutGroup = {
  title: 'Coaching points',
  shortcuts: [{ keys: ['P'], action: 'New point at the current moment' }],
};
