import type { Grade, GradeInput } from '@shared/api/grading';
import { snapResult, type Mark, type ResultRule, type SnapResult } from '@shared/grading';

/** One coach's grade of one lineman on one snap, as the desk edits it (the PUT body without version). */
export type GradeDraft = Omit<GradeInput, 'version'>;

export function blankDraft(): GradeDraft {
  return {
    assignment: null,
    missedReason: null,
    footwork: null,
    hands: null,
    padLevel: null,
    extra: {},
    effort: null,
    knockdowns: 0,
    pressuresAllowed: 0,
    sacksAllowed: 0,
    penalties: [],
    note: null,
  };
}

export function draftFromGrade(grade: Grade): GradeDraft {
  return {
    assignment: grade.assignment,
    missedReason: grade.missedReason,
    footwork: grade.footwork,
    hands: grade.hands,
    padLevel: grade.padLevel,
    extra: { ...grade.extra },
    effort: grade.effort,
    knockdowns: grade.knockdowns,
    pressuresAllowed: grade.pressuresAllowed,
    sacksAllowed: grade.sacksAllowed,
    penalties: grade.penalties.map((p) => ({ type: p.type })),
    note: grade.note,
  };
}

/** Key order and empty extras must not make two equal grades look different. */
export function sameDraft(a: GradeDraft, b: GradeDraft): boolean {
  return canonical(a) === canonical(b);
}

function canonical(d: GradeDraft): string {
  const extra = Object.keys(d.extra)
    .filter((k) => d.extra[k] !== null)
    .sort()
    .map((k) => `${k}=${d.extra[k]}`);
  return JSON.stringify([d.assignment, d.missedReason, d.footwork, d.hands, d.padLevel, extra, d.effort, d.knockdowns, d.pressuresAllowed, d.sacksAllowed, d.penalties.map((p) => p.type), d.note ?? null]);
}

/** The live result as the coach types (the server stores the same rule's answer on save). */
export function draftResult(draft: GradeDraft, rule: ResultRule, activeExtras: readonly string[]): SnapResult | null {
  const extra: Record<string, Mark | null> = {};
  for (const key of activeExtras) extra[key] = draft.extra[key] ?? null;
  return snapResult({ ...draft, extra }, rule);
}

/** The row-plus key: assignment right and every technique part and effort plus. Counts and notes stay. */
export function rowPlus(draft: GradeDraft, activeExtras: readonly string[]): GradeDraft {
  const extra = { ...draft.extra };
  for (const key of activeExtras) extra[key] = 'plus';
  return { ...draft, assignment: 'right', missedReason: null, footwork: 'plus', hands: 'plus', padLevel: 'plus', extra, effort: 'plus' };
}

/** The fill key: every part not graded yet becomes plus (right); marks already set stay. */
export function rowFill(draft: GradeDraft, activeExtras: readonly string[]): GradeDraft {
  const extra = { ...draft.extra };
  for (const key of activeExtras) extra[key] ??= 'plus';
  return {
    ...draft,
    assignment: draft.assignment ?? 'right',
    footwork: draft.footwork ?? 'plus',
    hands: draft.hands ?? 'plus',
    padLevel: draft.padLevel ?? 'plus',
    extra,
    effort: draft.effort ?? 'plus',
  };
}

/** Whether the coach has marked anything at all in the row. */
export function hasAnyMark(draft: GradeDraft): boolean {
  return !sameDraft(draft, blankDraft());
}
