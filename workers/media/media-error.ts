/**
 * Why a video could not be processed, in words a coach can act on. `reason` is shown on the clip;
 * `detail` (a short excerpt of ffmpeg's stderr) is for logs only. `permanent` tells the job handler
 * whether another attempt can help: a damaged file stays damaged, a missing tool may be fixed.
 */
export type MediaErrorCode =
  | 'empty'
  | 'not_video'
  | 'audio_only'
  | 'truncated'
  | 'damaged'
  | 'too_large'
  | 'timeout'
  | 'tool_missing'
  | 'failed';

const PERMANENT: Record<MediaErrorCode, boolean> = {
  empty: true,
  not_video: true,
  audio_only: true,
  truncated: true,
  damaged: true,
  too_large: true,
  timeout: true,
  tool_missing: false,
  failed: false,
};

export class MediaError extends Error {
  readonly permanent: boolean;

  constructor(
    readonly code: MediaErrorCode,
    readonly reason: string,
    readonly detail = '',
    /** ffmpeg's whole stderr (progress lines collapsed), for a second look such as locating damage. */
    readonly stderr = '',
  ) {
    super(reason);
    this.name = 'MediaError';
    this.permanent = PERMANENT[code];
  }

  static timeout(timeoutMs: number, detail = ''): MediaError {
    return new MediaError('timeout', `processing took longer than ${formatLimit(timeoutMs)}`, detail);
  }
}

export function isMediaError(value: unknown): value is MediaError {
  return value instanceof MediaError;
}

export const REASONS = {
  empty: 'the file is empty',
  not_video: 'not a video file',
  audio_only: 'the file has no video stream (audio only)',
  truncated: 'the file is cut short (truncated)',
  failed: 'the video could not be processed',
  tool_missing: 'the video tools are not installed on the worker',
} as const;

export interface FailureContext {
  /** The file starts like an MP4/QuickTime file (a known box at offset 4). */
  looksLikeMp4?: boolean;
  /** Where decoding stopped, when known better than the last progress line (see locateDamage). */
  nearSeconds?: number;
}

// With -xerror ffmpeg stops at the decoder's own complaint, often its only line, e.g.
// "[aac @ 0x55c7a3cfa600] channel element 3.0 is not allocated". [NULL @ …] is the H.264 parser.
const DECODER_LINE =
  /^\[(h264|hevc|mpeg4|mpeg1video|mpeg2video|mjpeg|vp8|vp9|av1|libdav1d|prores|dvvideo|vc1|wmv[123]|msmpeg4v?[123]?|aac|aac_latm|mp3|mp3float|mp2|mp2float|ac3|eac3|opus|vorbis|flac|alac|pcm_\w+|NULL) @ 0x[0-9a-f]+\] /m;

/**
 * Maps ffmpeg/ffprobe stderr to a code and reason. Pure, so every pattern is unit-tested against
 * real stderr lines. Order matters: the most specific pattern wins.
 */
export function classifyFailure(stderr: string, context: FailureContext = {}): { code: MediaErrorCode; reason: string } {
  if (/not on whitelist/i.test(stderr)) return { code: 'not_video', reason: REASONS.not_video };
  // ffmpeg picks the MP4 demuxer for any *.mp4 name, so "moov atom not found" alone does not mean
  // a cut-short MP4: only a file that starts with MP4 boxes is truncated; anything else is not video.
  if (/moov atom not found/i.test(stderr)) {
    return context.looksLikeMp4 ? { code: 'truncated', reason: REASONS.truncated } : { code: 'not_video', reason: REASONS.not_video };
  }
  // The MP4 demuxer says "partial file" when a sample lies past the end of the file.
  if (/: partial file|Truncating packet of size/i.test(stderr)) return { code: 'truncated', reason: REASONS.truncated };
  if (/Error while decoding stream|corrupt input packet|corrupt decoded frame/i.test(stderr) || DECODER_LINE.test(stderr)) {
    const near = context.nearSeconds ?? lastProgressSeconds(stderr) ?? 0;
    return { code: 'damaged', reason: `stream unreadable near ${formatMediaTime(near)}` };
  }
  if (/Stream map '0:v:0' matches no streams|does not contain any stream/i.test(stderr)) {
    return { code: 'audio_only', reason: REASONS.audio_only };
  }
  if (/Invalid data found when processing input|could not find codec parameters|Unknown input format/i.test(stderr)) {
    return { code: 'not_video', reason: REASONS.not_video };
  }
  return { code: 'failed', reason: REASONS.failed };
}

export function mediaErrorFromStderr(stderr: string, context: FailureContext = {}): MediaError {
  const { code, reason } = classifyFailure(stderr, context);
  return new MediaError(code, reason, excerpt(stderr), stderr);
}

/** The last `time=HH:MM:SS.xx` progress mark ffmpeg printed, in seconds (where decoding had got to). */
export function lastProgressSeconds(stderr: string): number | undefined {
  let last: number | undefined;
  for (const match of stderr.matchAll(/time=\s*(-?)(\d+):(\d{2}):(\d{2}(?:\.\d+)?)/g)) {
    const seconds = Number(match[2]) * 3600 + Number(match[3]) * 60 + Number(match[4]);
    last = match[1] === '-' ? 0 : seconds;
  }
  return last;
}

/** Seconds → "m:ss" (or "h:mm:ss"), the way a coach reads a game clock. */
export function formatMediaTime(seconds: number): string {
  const total = Math.max(0, Math.floor(Number.isFinite(seconds) ? seconds : 0));
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = String(total % 60).padStart(2, '0');
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${s}` : `${m}:${s}`;
}

/** 300000 → "5 min", 90000 → "90 s": the limit as configured, in the unit a person would say. */
export function formatLimit(ms: number): string {
  if (ms >= 60_000 && ms % 60_000 === 0) return `${ms / 60_000} min`;
  if (ms >= 1000) return `${Math.round(ms / 100) / 10} s`;
  return `${ms} ms`;
}

/** Error-looking lines, without progress lines, capped for logs. */
function excerpt(stderr: string): string {
  const lines = stderr
    .split(/\r\n|\r|\n/)
    .filter((line) => line.trim() && !/^frame=|^size=/.test(line.trim()))
    .slice(-12);
  return lines.join('\n').slice(-2000);
}
