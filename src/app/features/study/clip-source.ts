import type { Angle } from '@shared/film';
import type { PlayerSource } from '../snap-player/player-source';

/**
 * The player's source for a clip known only by its URLs (queue and cut-up entries carry no frame
 * rate or scrub strip); nothing to play until it has a playback rendition.
 */
export function clipSource(clip: { clipId: number; angle: string; playbackUrl: string | null; posterUrl: string | null; durationMs?: number | null }): PlayerSource[] {
  if (!clip.playbackUrl) return [];
  return [{ clipId: clip.clipId, angle: clip.angle as Angle, playbackUrl: clip.playbackUrl, posterUrl: clip.posterUrl, fps: null, durationMs: clip.durationMs ?? null, stripUrl: null, strip: null }];
}
