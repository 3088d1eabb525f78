import type { Scheme } from '@shared/api/grading';
import { COMPONENT_LABELS } from '@shared/grading';

export type CountField = 'knockdowns' | 'pressuresAllowed' | 'sacksAllowed';
export type BaseMarkField = 'footwork' | 'hands' | 'padLevel';

/** One column of the grade grid, in left-to-right order. */
export type GradeColumn =
  | { id: 'assignment'; kind: 'assignment'; label: string }
  | { id: string; kind: 'mark'; label: string; field: BaseMarkField | { extra: string } }
  | { id: 'effort'; kind: 'effort'; label: string }
  | { id: CountField; kind: 'count'; label: string; field: CountField }
  | { id: 'penalties'; kind: 'penalties'; label: string }
  | { id: 'note'; kind: 'note'; label: string }
  | { id: 'result'; kind: 'result'; label: string };

export type ColumnKind = GradeColumn['kind'];

/** The grid's columns for a scheme: the base parts, the team's active extra parts, counts, note, result. */
export function gradeColumns(scheme: Pick<Scheme, 'extraComponents'>): GradeColumn[] {
  const base: GradeColumn[] = (['footwork', 'hands', 'padLevel'] as const).map((field) => ({ id: field, kind: 'mark', label: COMPONENT_LABELS[field], field }));
  const extras: GradeColumn[] = scheme.extraComponents
    .filter((c) => c.active)
    .map((c) => ({ id: `extra:${c.key}`, kind: 'mark', label: c.label, field: { extra: c.key } }));
  return [
    { id: 'assignment', kind: 'assignment', label: 'Assignment' },
    ...base,
    ...extras,
    { id: 'effort', kind: 'effort', label: 'Effort' },
    { id: 'knockdowns', kind: 'count', label: 'Knockdowns', field: 'knockdowns' },
    { id: 'pressuresAllowed', kind: 'count', label: 'Pressures', field: 'pressuresAllowed' },
    { id: 'sacksAllowed', kind: 'count', label: 'Sacks', field: 'sacksAllowed' },
    { id: 'penalties', kind: 'penalties', label: 'Penalties' },
    { id: 'note', kind: 'note', label: 'Note' },
    { id: 'result', kind: 'result', label: 'Result' },
  ];
}

export function activeExtraKeys(scheme: Pick<Scheme, 'extraComponents'>): string[] {
  return scheme.extraComponents.filter((c) => c.active).map((c) => c.key);
}
