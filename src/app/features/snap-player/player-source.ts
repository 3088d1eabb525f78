import type { Clip } from '@shared/api/film';
import type { Angle } from '@shared/film';
import type { StripLayout } from './strip-tile';

/** What the player needs to show one angle of a snap (or a whole tape). */
export interface PlayerSource {
  clipId: number;
  angle: Angle;
  playbackUrl: string;
  posterUrl: string | null;
  fps: number | null;
  durationMs: number | null;
  stripUrl: string | null;
  strip: StripLayout | null;
}

/** A clip becomes a source once the server has a playable rendition of it. */
export function playerSourceFrom(clip: Clip): PlayerSource | null {
  if (clip.status !== 'ready' || !clip.playbackUrl) return null;
  return {
    clipId: clip.id,
    angle: clip.angle,
    playbackUrl: clip.playbackUrl,
    posterUrl: clip.posterUrl,
    fps: clip.fps,
    durationMs: clip.durationMs,
    stripUrl: clip.stripUrl,
    strip: clip.strip,
  };
}

/** Frames per second to step by when the probe gave none (most phone and camera film). */
export const FALLBACK_FPS = 30;

export const PLAYBACK_SPEEDS = [0.25, 0.5, 1, 2] as const;

/** The next speed up or down the list, staying at the ends. */
export function nextSpeed(current: number, direction: 1 | -1): number {
  const index = PLAYBACK_SPEEDS.findIndex((s) => s === current);
  const from = index === -1 ? PLAYBACK_SPEEDS.indexOf(1) : index;
  return PLAYBACK_SPEEDS[Math.min(PLAYBACK_SPEEDS.length - 1, Math.max(0, from + direction))];
}

/** One frame (or `frames` frames) away from `seconds`, kept inside the video. */
export function frameStep(seconds: number, fps: number | null, frames: number, durationSeconds: number): number {
  const rate = fps && fps > 0 ? fps : FALLBACK_FPS;
  const target = seconds + frames / rate;
  const end = Number.isFinite(durationSeconds) && durationSeconds > 0 ? durationSeconds : Number.POSITIVE_INFINITY;
  return Math.min(end, Math.max(0, target));
}
