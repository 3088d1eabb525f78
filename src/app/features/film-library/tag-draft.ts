import type { SnapTags, SnapTagsUpdate } from '@shared/api/film';
import { PERSONNEL_PATTERN, type Direction, type FieldSide, type Hash } from '@shared/film';

/** The Snap Tags form as typed: numbers typed into fields stay text until saved. */
export interface TagDraft {
  quarter: number | null;
  down: number | null;
  distance: string;
  yardLine: string;
  fieldSide: FieldSide | null;
  hash: Hash | null;
  personnel: string;
  formationId: number | null;
  conceptId: number | null;
  direction: Direction | null;
  frontId: number | null;
  resultYards: string;
  outcomeId: number | null;
  period: string | null;
  notes: string;
}

export type TagField = keyof TagDraft & keyof SnapTags;
export type TagErrors = Partial<Record<TagField, string>>;

export const TAG_FIELDS: readonly TagField[] = [
  'quarter', 'down', 'distance', 'yardLine', 'fieldSide', 'hash', 'personnel', 'formationId',
  'conceptId', 'direction', 'frontId', 'resultYards', 'outcomeId', 'period', 'notes',
];

export const BLANK_DRAFT: TagDraft = {
  quarter: null, down: null, distance: '', yardLine: '', fieldSide: null, hash: null, personnel: '', formationId: null,
  conceptId: null, direction: null, frontId: null, resultYards: '', outcomeId: null, period: null, notes: '',
};

const text = (value: number | string | null) => (value === null ? '' : String(value));

export function draftFromSnap(snap: SnapTags): TagDraft {
  return {
    ...snap,
    distance: text(snap.distance),
    yardLine: text(snap.yardLine),
    personnel: snap.personnel ?? '',
    resultYards: text(snap.resultYards),
    notes: snap.notes ?? '',
  };
}

/** "", "7", "-3" or "−3" → a whole number or null; anything else is a typing error. */
function parseWhole(raw: string): number | null | 'bad' {
  const cleaned = raw.trim().replace(/^[−–]/, '-').replace(/^\+/, '');
  if (cleaned === '') return null;
  return /^-?\d+$/.test(cleaned) ? Number(cleaned) : 'bad';
}

/** The draft in API values, with the fields that cannot be read. */
export function readDraft(draft: TagDraft): { tags: SnapTags; errors: TagErrors } {
  const errors: TagErrors = {};
  const whole = (field: 'distance' | 'yardLine' | 'resultYards') => {
    const value = parseWhole(draft[field]);
    if (value === 'bad') {
      errors[field] = 'Use a whole number.';
      return null;
    }
    return value;
  };
  const tags: SnapTags = {
    ...draft,
    distance: whole('distance'),
    yardLine: whole('yardLine'),
    resultYards: whole('resultYards'),
    personnel: draft.personnel.trim() === '' ? null : draft.personnel.trim(),
    notes: draft.notes.trim() === '' ? null : draft.notes,
  };
  return { tags, errors };
}

/**
 * What to send: the fields whose value differs from `base` (one snap), plus `alwaysSend` (the fields
 * touched in a bulk edit, even when cleared). Only what the form can tell by itself is checked here
 * (whole numbers, two-digit personnel); ranges are the server's rules, and its 422 messages are
 * shown on the fields. (The shared zod schema would add 450 kB to this page.)
 */
export function changedTags(draft: TagDraft, base: TagDraft, alwaysSend: ReadonlySet<TagField> = new Set()): { update: SnapTagsUpdate; errors: TagErrors } {
  const next = readDraft(draft);
  const before = readDraft(base).tags;
  const update: Record<string, unknown> = {};
  for (const field of TAG_FIELDS) {
    if (alwaysSend.has(field) || next.tags[field] !== before[field]) update[field] = next.tags[field];
  }
  const errors: TagErrors = { ...next.errors };
  const personnel = next.tags.personnel;
  if ('personnel' in update && personnel !== null && !PERSONNEL_PATTERN.test(personnel)) {
    errors.personnel = 'Personnel is two digits: backs, then tight ends (e.g. 11).';
  }
  return { update: update as SnapTagsUpdate, errors };
}
