import type { EffortMark, Mark } from '@shared/grading';
import type { GradeColumn } from './grade-columns';
import type { GradeDraft } from './grade-draft';

/** What a key (or a click) asks of the cell it lands on. */
export type CellEdit =
  | { kind: 'plus' }
  | { kind: 'minus' }
  | { kind: 'clear' }
  | { kind: 'cycle' }
  /** A whole number typed into a count cell (the grid joins quick digits into 12). */
  | { kind: 'count'; value: number }
  /** Digit n picks the n-th item of the column's list: missed reason or penalty type. */
  | { kind: 'pick'; index: number };

export interface EditLists {
  missedReasons: readonly string[];
  penaltyTypes: readonly string[];
}

export const MAX_COUNT = 99;

const MARK_CYCLE: readonly (Mark | null)[] = [null, 'plus', 'minus'];
const EFFORT_CYCLE: readonly (EffortMark | null)[] = [null, 'plus', 'minus', 'loaf'];
const ASSIGNMENT_CYCLE = [null, 'right', 'missed'] as const;

function next<T>(cycle: readonly T[], current: T): T {
  return cycle[(cycle.indexOf(current) + 1) % cycle.length];
}

function readMark(draft: GradeDraft, field: Extract<GradeColumn, { kind: 'mark' }>['field']): Mark | null {
  return typeof field === 'string' ? draft[field] : (draft.extra[field.extra] ?? null);
}

function writeMark(draft: GradeDraft, field: Extract<GradeColumn, { kind: 'mark' }>['field'], mark: Mark | null): GradeDraft {
  return typeof field === 'string' ? { ...draft, [field]: mark } : { ...draft, extra: { ...draft.extra, [field.extra]: mark } };
}

/**
 * The draft after `edit` on `column`, or null when the edit means nothing there (the grid then
 * says so instead of changing anything). Pure, so every key's effect is tested as data.
 */
export function applyCellEdit(draft: GradeDraft, column: GradeColumn, edit: CellEdit, lists: EditLists): GradeDraft | null {
  switch (column.kind) {
    case 'assignment': {
      if (edit.kind === 'pick') {
        const reason = lists.missedReasons[edit.index];
        return reason === undefined ? null : { ...draft, assignment: 'missed', missedReason: reason };
      }
      const value =
        edit.kind === 'plus' ? 'right' : edit.kind === 'minus' ? 'missed' : edit.kind === 'clear' ? null : edit.kind === 'cycle' ? next(ASSIGNMENT_CYCLE, draft.assignment) : undefined;
      if (value === undefined) return null;
      return { ...draft, assignment: value, missedReason: value === 'missed' ? draft.missedReason : null };
    }
    case 'mark': {
      const current = readMark(draft, column.field);
      const value = edit.kind === 'plus' ? 'plus' : edit.kind === 'minus' ? 'minus' : edit.kind === 'clear' ? null : edit.kind === 'cycle' ? next(MARK_CYCLE, current) : undefined;
      return value === undefined ? null : writeMark(draft, column.field, value);
    }
    case 'effort': {
      const value = edit.kind === 'plus' ? 'plus' : edit.kind === 'minus' ? 'minus' : edit.kind === 'clear' ? null : edit.kind === 'cycle' ? next(EFFORT_CYCLE, draft.effort) : undefined;
      return value === undefined ? null : { ...draft, effort: value };
    }
    case 'count': {
      const current = draft[column.field];
      const value =
        edit.kind === 'count' ? edit.value : edit.kind === 'plus' || edit.kind === 'cycle' ? current + 1 : edit.kind === 'minus' ? current - 1 : edit.kind === 'clear' ? 0 : undefined;
      return value === undefined ? null : { ...draft, [column.field]: Math.min(MAX_COUNT, Math.max(0, value)) };
    }
    case 'penalties': {
      if (edit.kind === 'pick') {
        const type = lists.penaltyTypes[edit.index];
        return type === undefined || draft.penalties.length >= 10 ? null : { ...draft, penalties: [...draft.penalties, { type }] };
      }
      if (edit.kind === 'minus') return draft.penalties.length === 0 ? null : { ...draft, penalties: draft.penalties.slice(0, -1) };
      if (edit.kind === 'clear') return { ...draft, penalties: [] };
      return null;
    }
    case 'note':
    case 'result':
      return null;
  }
}

/** Loaf is about effort and belongs to the row, whatever cell has the focus. */
export function markLoaf(draft: GradeDraft): GradeDraft {
  return { ...draft, effort: 'loaf' };
}

export function markAssignment(draft: GradeDraft, value: 'right' | 'missed'): GradeDraft {
  return { ...draft, assignment: value, missedReason: value === 'missed' ? draft.missedReason : null };
}
