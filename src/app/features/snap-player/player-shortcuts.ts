import type { ShortcutGroup } from './shortcut-keys';

/** The player's keys, as shown on screen and in the help dialog. */
export const PLAYER_SHORTCUTS: ShortcutGroup = {
  title: 'Video',
  shortcuts: [
    { keys: ['Space'], action: 'Play or pause' },
    { keys: ['←', '→'], action: 'One frame back or forward' },
    { keys: ['Shift+←', 'Shift+→'], action: 'One second back or forward' },
    { keys: ['[', ']'], action: 'Slower or faster (¼×, ½×, 1×, 2×)' },
    { keys: ['A'], action: 'Next camera angle, same moment' },
    { keys: ['I', 'O'], action: 'Set the loop start or end here' },
    { keys: ['L'], action: 'Loop on or off' },
  ],
};
