import type { Clip } from '@shared/api/film';
import type { ClipState, SessionKind } from '@shared/film';

/** Clip states are shown as a word and an icon; colour only repeats them. */
export const CLIP_STATE_ICONS: Record<ClipState, string> = {
  received: 'hourglass_empty',
  processing: 'autorenew',
  ready: 'check_circle',
  failed: 'report',
};

export const SESSION_KIND_LABELS: Record<SessionKind, string> = { game: 'Game', scrimmage: 'Scrimmage', practice: 'Practice' };
export const SESSION_KIND_ICONS: Record<SessionKind, string> = { game: 'stadium', scrimmage: 'groups', practice: 'fitness_center' };

export function isFinalState(state: ClipState): boolean {
  return state === 'ready' || state === 'failed';
}

/** Nothing left for the worker: polling can stop. */
export function allClipsFinal(clips: readonly Pick<Clip, 'status'>[]): boolean {
  return clips.every((c) => isFinalState(c.status));
}
