import type { ShortcutGroup } from '../snap-player/shortcut-keys';

/** The desk's own key actions; the coach may put them on other keys (see KeyMapStore). */
export const GRADE_ACTIONS = [
  'plus',
  'minus',
  'clear',
  'right',
  'missed',
  'loaf',
  'rowPlus',
  'rowFill',
  'note',
  'nextSnap',
  'previousSnap',
  'compare',
  'focusGrid',
  'help',
] as const;
export type GradeAction = (typeof GRADE_ACTIONS)[number];
export type KeyMap = Record<GradeAction, readonly string[]>;

export const GRADE_ACTION_LABELS: Record<GradeAction, string> = {
  plus: 'Plus in this cell (right on Assignment, +1 on a count)',
  minus: 'Minus in this cell (missed on Assignment, −1 on a count, remove last penalty)',
  clear: 'Not graded (count back to 0, penalties cleared)',
  right: 'Assignment right, from any cell of the row',
  missed: 'Missed assignment, from any cell of the row',
  loaf: 'Loaf on effort, from any cell of the row',
  rowPlus: 'Whole row plus (assignment right, every part plus, effort plus), then next row',
  rowFill: 'Rest of the row plus (keeps marks already set), then next row',
  note: 'Open the note and details of this row',
  nextSnap: 'Next snap',
  previousSnap: 'Previous snap',
  compare: 'Compare with the other coaches on this snap',
  focusGrid: 'Back to the grade grid (from the video or elsewhere)',
  help: 'Show every shortcut',
};

export const DEFAULT_KEY_MAP: KeyMap = {
  plus: ['=', '+'],
  minus: ['-'],
  clear: ['0', 'Backspace', 'Delete'],
  right: ['r'],
  missed: ['m'],
  loaf: ['l'],
  rowPlus: ['p', 'Shift+Enter'],
  rowFill: ['f'],
  note: ['n'],
  nextSnap: ['PageDown', '.'],
  previousSnap: ['PageUp', ','],
  compare: ['c'],
  focusGrid: ['g'],
  help: ['?'],
};

/**
 * Keys the grid keeps for itself: moving between cells, digits in count and list cells, Space
 * for the video, Escape to leave a dialog. They cannot be given to an action.
 */
export const RESERVED_KEYS: readonly string[] = [
  'ArrowUp', 'ArrowDown', 'ArrowLeft', 'ArrowRight', 'Shift+ArrowLeft', 'Shift+ArrowRight', 'Tab', 'Shift+Tab', 'Home', 'End',
  'Enter', 'Escape', 'Space', '1', '2', '3', '4', '5', '6', '7', '8', '9',
];

/**
 * A key press as the map writes it: printable keys as typed (letters in lower case, so Caps Lock
 * does not matter), named keys with "Shift+" when Shift is held. Null with Ctrl, Alt or Meta:
 * those belong to the browser.
 */
export function keyName(event: Pick<KeyboardEvent, 'key' | 'shiftKey' | 'ctrlKey' | 'altKey' | 'metaKey'>): string | null {
  if (event.ctrlKey || event.altKey || event.metaKey) return null;
  const key = event.key;
  if (!key || key === 'Unidentified' || key === 'Dead' || ['Shift', 'Control', 'Alt', 'Meta', 'CapsLock'].includes(key)) return null;
  if (key === ' ') return 'Space';
  if (key.length === 1) return /[a-z]/i.test(key) ? key.toLowerCase() : key;
  return event.shiftKey ? `Shift+${key}` : key;
}

export function actionFor(map: KeyMap, name: string): GradeAction | null {
  return GRADE_ACTIONS.find((action) => map[action].includes(name)) ?? null;
}

/** How a key is shown on screen. */
export function keyLabel(name: string): string {
  const labels: Record<string, string> = {
    ArrowUp: '↑', ArrowDown: '↓', ArrowLeft: '←', ArrowRight: '→', Backspace: '⌫ Backspace', Delete: 'Del', PageDown: 'PgDn', PageUp: 'PgUp',
  };
  return name.split('+').map((part, i, all) => (i === all.length - 1 ? (labels[part] ?? (part.length === 1 ? part.toUpperCase() : part)) : part)).join('+');
}

/** The keys for the on-screen legend and the help dialog, following the coach's own map. */
export function gradeShortcutGroups(map: KeyMap): ShortcutGroup[] {
  const keys = (action: GradeAction) => map[action].map(keyLabel);
  const line = (action: GradeAction) => ({ keys: keys(action), action: GRADE_ACTION_LABELS[action] });
  return [
    {
      title: 'Grade grid',
      shortcuts: [
        { keys: ['↑', '↓', '←', '→'], action: 'Move between cells' },
        { keys: ['Tab', 'Shift+Tab'], action: 'Next or previous cell' },
        { keys: ['Home', 'End'], action: 'First or last cell of the row' },
        line('rowPlus'),
        line('rowFill'),
        line('plus'),
        line('minus'),
        line('clear'),
        line('right'),
        line('missed'),
        line('loaf'),
        { keys: ['0–9'], action: 'Counts: type the number (quick digits make 12)' },
        { keys: ['1–9'], action: 'Assignment: missed, for the reason with that number · Penalties: add the type with that number' },
        { keys: ['Enter'], action: 'Step the mark (not graded → plus → minus…); on Note or Penalties, open the details' },
        line('note'),
      ],
    },
    {
      title: 'Desk',
      shortcuts: [line('nextSnap'), line('previousSnap'), line('focusGrid'), line('compare'), line('help')],
    },
  ];
}
