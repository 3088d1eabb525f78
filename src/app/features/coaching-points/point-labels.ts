import { formatClock } from '@shared/film';
import { COMMENT_KIND_LABELS, type CommentKind } from '@shared/film-room';
import { COMPONENT_LABELS } from '@shared/grading';

/** An icon beside every kind label, so the kind never rests on colour. */
export const COMMENT_KIND_ICONS: Record<CommentKind, string> = {
  praise: 'thumb_up',
  correction: 'build',
  teaching: 'school',
  question: 'help',
  reply: 'reply',
};

/** The parts a point can be about: the grade's fixed parts plus footwork, hands and pad level. */
export const POINT_COMPONENTS = ['assignment', 'footwork', 'hands', 'padLevel', 'effort'] as const;
export type PointComponent = (typeof POINT_COMPONENTS)[number];

export const POINT_COMPONENT_LABELS: Record<string, string> = {
  assignment: 'Assignment',
  ...COMPONENT_LABELS,
  effort: 'Effort',
};

export function kindLabel(kind: string): string {
  return COMMENT_KIND_LABELS[kind as CommentKind] ?? kind;
}

export function kindIcon(kind: string): string {
  return COMMENT_KIND_ICONS[kind as CommentKind] ?? 'chat';
}

/** The label of a grade part, also for a team's own extra parts (their key when nothing better is known). */
export function componentLabel(key: string, extra: ReadonlyMap<string, string> = new Map()): string {
  return POINT_COMPONENT_LABELS[key] ?? extra.get(key) ?? key;
}

/** "0:03.2" for a moment, "0:03.2–0:05.0" for a span. */
export function momentLabel(atMs: number, endMs: number | null | undefined): string {
  return endMs !== null && endMs !== undefined && endMs > atMs ? `${formatClock(atMs)}–${formatClock(endMs)}` : formatClock(atMs);
}
