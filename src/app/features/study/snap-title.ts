import { ANGLE_LABELS, type Angle } from '@shared/film';

/** "Snap 12 · Sideline"; a clip that is not a snap of its own says "Clip". */
export function snapTitle(snapOrder: number | null, angle: string): string {
  return `${snapOrder !== null ? `Snap ${snapOrder}` : 'Clip'} · ${ANGLE_LABELS[angle as Angle] ?? angle}`;
}
