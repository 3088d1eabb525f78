import type { Direction, FieldSide, Hash } from '@shared/film';
import type { ShortcutGroup } from '../snap-player/shortcut-keys';
import type { TagField } from './tag-draft';

/** What a key does in the Snap Tags panel. Kept as data so the key map can become editable. */
export type TagKeyAction =
  | { kind: 'set'; field: 'down'; value: number }
  | { kind: 'cycle'; field: 'quarter' | 'hash' | 'direction' | 'fieldSide' }
  | { kind: 'focus'; field: TagField };

export const TAG_KEYS: Readonly<Record<string, TagKeyAction>> = {
  '1': { kind: 'set', field: 'down', value: 1 },
  '2': { kind: 'set', field: 'down', value: 2 },
  '3': { kind: 'set', field: 'down', value: 3 },
  '4': { kind: 'set', field: 'down', value: 4 },
  q: { kind: 'cycle', field: 'quarter' },
  h: { kind: 'cycle', field: 'hash' },
  r: { kind: 'cycle', field: 'direction' },
  s: { kind: 'cycle', field: 'fieldSide' },
  d: { kind: 'focus', field: 'distance' },
  y: { kind: 'focus', field: 'yardLine' },
  p: { kind: 'focus', field: 'personnel' },
  m: { kind: 'focus', field: 'formationId' },
  c: { kind: 'focus', field: 'conceptId' },
  f: { kind: 'focus', field: 'frontId' },
  g: { kind: 'focus', field: 'resultYards' },
  u: { kind: 'focus', field: 'outcomeId' },
  e: { kind: 'focus', field: 'period' },
  n: { kind: 'focus', field: 'notes' },
};

/** The key shown next to each field's label. */
export const FIELD_KEYS: Partial<Record<TagField, string>> = Object.fromEntries(
  Object.entries(TAG_KEYS)
    .filter(([, action]) => action.kind !== 'set')
    .map(([key, action]) => [action.field, key.toUpperCase()]),
);

/** Each press moves to the next value; after the last one the field is empty again. */
export const CYCLES: {
  quarter: readonly (number | null)[];
  hash: readonly (Hash | null)[];
  direction: readonly (Direction | null)[];
  fieldSide: readonly (FieldSide | null)[];
} = {
  quarter: [1, 2, 3, 4, 5, null],
  hash: ['left', 'middle', 'right', null],
  direction: ['left', 'middle', 'right', null],
  fieldSide: ['own', 'opp', null],
};

export function nextInCycle<T>(cycle: readonly (T | null)[], current: T | null): T | null {
  const index = cycle.indexOf(current);
  return cycle[(index + 1) % cycle.length] ?? null;
}

export const TAG_SHORTCUTS: ShortcutGroup = {
  title: 'Snap Tags',
  shortcuts: [
    { keys: ['1', '2', '3', '4'], action: 'Down' },
    { keys: ['Q'], action: 'Quarter (1, 2, 3, 4, OT, none)' },
    { keys: ['S'], action: 'Side of the field (own, opp, none)' },
    { keys: ['H'], action: 'Hash (left, middle, right, none)' },
    { keys: ['R'], action: 'Direction (left, middle, right, none)' },
    { keys: ['D', 'Y', 'G'], action: 'Type distance, yard line or gain' },
    { keys: ['P'], action: 'Type personnel (two digits)' },
    { keys: ['M', 'C', 'F', 'U'], action: 'Choose formation, concept, front or outcome' },
    { keys: ['E', 'N'], action: 'Period or notes' },
    { keys: ['Enter'], action: 'Save (Ctrl+Enter in notes)' },
    { keys: ['Esc'], action: 'Leave the field, keys work again' },
  ],
};

export const SNAP_LIST_SHORTCUTS: ShortcutGroup = {
  title: 'Snaps',
  shortcuts: [
    { keys: ['J', '↓'], action: 'Next snap (saves first)' },
    { keys: ['K', '↑'], action: 'Previous snap (saves first)' },
    { keys: ['Shift+J', 'Shift+↓'], action: 'Grow the selection down' },
    { keys: ['Shift+K', 'Shift+↑'], action: 'Grow the selection up' },
    { keys: ['Shift+click'], action: 'Select a range for bulk tags' },
    { keys: ['?'], action: 'All shortcuts' },
  ],
};
