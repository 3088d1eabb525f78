/**
 * What the clip jobs need from the media toolkit (workers/media): file in, file out, facts back.
 * Kept as an interface so the handlers read as the pipeline they are, and tests can see each step.
 */
export interface ProbeFacts {
  formatName: string;
  durationMs: number;
  width: number;
  height: number;
  fps: number;
  videoCodec: string;
  audioCodec: string | null;
  pixelFormat: string | null;
  rotation: number;
  hasVideo: boolean;
  hasAudio: boolean;
}

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

/** A media failure a coach can read ("not a video file", "stream unreadable near 0:12"…). */
export interface HumanReadableMediaError {
  reason: string;
}

export function humanReason(error: unknown): string | null {
  const reason = (error as Partial<HumanReadableMediaError> | null)?.reason;
  return typeof reason === 'string' && reason.length > 0 ? reason : null;
}
