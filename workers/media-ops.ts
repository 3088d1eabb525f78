import type { ProbeResult } from './media';

/**
 * What the clip jobs need from the media toolkit (workers/media): file in, file out, facts back.
 * An interface so the handlers read as the pipeline they are, and tests can swap a step.
 */
export type ProbeFacts = ProbeResult;

export interface StripFacts {
  frames: number;
  intervalMs: number;
  tileWidth: number;
  tileHeight: number;
}

export interface MediaOps {
  probe(input: string): Promise<ProbeFacts>;
  poster(input: string, output: string, probe: ProbeFacts): Promise<void>;
  strip(input: string, output: string, probe: ProbeFacts, frames: number): Promise<StripFacts>;
  /** Writes a web-playable MP4 to output, or answers 'skip' when the input already is one. */
  rendition(input: string, output: string, probe: ProbeFacts, maxHeight: number): Promise<'skip' | 'remux' | 'transcode'>;
  detectScenes(input: string, threshold: number): Promise<number[]>;
  cut(input: string, output: string, startMs: number, endMs: number, probe: ProbeFacts): Promise<void>;
  withTempDir<T>(fn: (dir: string) => Promise<T>): Promise<T>;
}

/**
 * A failure a coach can read ("not a video file", "stream unreadable near 0:12"…) that will not
 * change on a retry. Errors that might pass (a timeout under load, storage down) return null.
 */
export function humanReason(error: unknown): string | null {
  const e = error as { reason?: unknown; permanent?: unknown } | null;
  if (typeof e?.reason !== 'string' || e.reason.length === 0) return null;
  return e.permanent === false ? null : e.reason;
}
