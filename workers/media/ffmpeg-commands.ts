/**
 * Every ffmpeg/ffprobe invocation, built as plain data by pure functions (no I/O, no process), so
 * each argument is unit-tested as an array and the runner that executes them can be swapped alone.
 *
 * Safety on untrusted files (SECURITY.md, "Uploads and media"): argument arrays only, never a
 * shell; `file:` URLs of absolute paths, so a name like "http:x" or "-i" is only ever a file;
 * `-protocol_whitelist file`; a demuxer allowlist (no HLS/concat playlists that read other files);
 * `-enable_drefs 0 -use_absolute_path 0` for MP4/MOV inputs (ffmpeg 5.1 refuses these two for other
 * demuxers: "Option enable_drefs not found", so they are added from the probed format name); numbers
 * in filter graphs only after validation; data streams and metadata (phone GPS tags) not copied.
 */
import { isAbsolute } from 'node:path';
import type { ProbeResult, VideoPacket } from './probe-result';

export interface FfmpegInput {
  /** Options placed before this input's `-i`. */
  options: string[];
  /** `file:` URL of an absolute path. */
  url: string;
}

export interface FfmpegCommand {
  /** Options for the whole run; placed first. */
  globalOptions: string[];
  inputs: FfmpegInput[];
  outputOptions: string[];
  /** `file:` URL, or `-` for the null muxer. */
  output: string;
  /** Seconds of media the run covers, for progress fractions; null when unknown. */
  durationSeconds: number | null;
}

/** Containers we accept (ffmpeg demuxer names); audio ones only so that an MP3 is named "audio only". */
export const ALLOWED_DEMUXERS = ['mov', 'matroska', 'avi', 'mpegts', 'mpeg', 'asf', 'mp3', 'wav', 'ogg', 'flac', 'aac'] as const;

export const WEB_VIDEO = { codec: 'libx264', preset: 'veryfast', crf: 23, pixelFormat: 'yuv420p', audioCodec: 'aac' } as const;

// ── Shared pieces ────────────────────────────────────────────────────────────────────────────

export interface CommandBase {
  /** Absolute path of the source file. */
  input: string;
  /** ProbeResult.formatName of the source: decides the MP4-only safety options. */
  inputFormat: string;
  /** Stop at the first decoding error (-xerror) so damage is reported, not silently concealed. */
  strict?: boolean;
}

export function isMovFamily(formatName: string): boolean {
  const names = formatName.split(',');
  return names.includes('mov') || names.includes('mp4');
}

export function fileUrl(path: string): string {
  if (typeof path !== 'string' || !isAbsolute(path) || path.includes('\0')) {
    throw new RangeError(`expected an absolute file path, got ${JSON.stringify(path)}`);
  }
  return `file:${path}`;
}

/** Input options every ffmpeg run on an uploaded file gets. */
export function inputGuards(inputFormat: string): string[] {
  return [
    '-protocol_whitelist', 'file',
    '-format_whitelist', ALLOWED_DEMUXERS.join(','),
    ...(isMovFamily(inputFormat) ? ['-enable_drefs', '0', '-use_absolute_path', '0'] : []),
  ];
}

export function globalOptions(options: { strict?: boolean; logLevel?: 'error' | 'info' } = {}): string[] {
  return [
    '-nostdin', '-hide_banner', '-y',
    '-loglevel', options.logLevel ?? 'error',
    // Progress lines ("time=…") drive onProgress and locate damage; printed even at -loglevel error.
    '-stats', '-stats_period', '0.1',
    ...(options.strict === false ? [] : ['-xerror']),
  ];
}

/** Validates a number that will be written into an argument or a filter graph. */
export function checkNumber(name: string, value: number, limits: { min?: number; max?: number; integer?: boolean; above?: number } = {}): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new RangeError(`${name} must be a finite number, got ${String(value)}`);
  if (limits.integer && !Number.isInteger(value)) throw new RangeError(`${name} must be an integer, got ${value}`);
  if (limits.above !== undefined && !(value > limits.above)) throw new RangeError(`${name} must be above ${limits.above}, got ${value}`);
  if (value < (limits.min ?? 0)) throw new RangeError(`${name} must be at least ${limits.min ?? 0}, got ${value}`);
  if (limits.max !== undefined && value > limits.max) throw new RangeError(`${name} must be at most ${limits.max}, got ${value}`);
  return value;
}

/** Seconds as ffmpeg reads them: plain decimals, microsecond precision, never exponent notation. */
export function formatSeconds(value: number): string {
  return String(Number(value.toFixed(6)));
}

const MAX_SECONDS = 24 * 3600;

/** The full argv (without the binary) that a command stands for. */
export function toArgs(command: FfmpegCommand): string[] {
  return [
    ...command.globalOptions,
    ...command.inputs.flatMap((input) => [...input.options, '-i', input.url]),
    ...command.outputOptions,
    command.output,
  ];
}

// ── ffprobe ──────────────────────────────────────────────────────────────────────────────────

// ffprobe, unlike ffmpeg, ignores demuxer options the chosen demuxer lacks, so the MP4 guards can
// be passed before the format is known (checked on Matroska in the integration suite).
function probeGuards(): string[] {
  return [...inputGuards('mov'), '-v', 'error', '-hide_banner'];
}

export function probeArgs(input: string): string[] {
  return [...probeGuards(), '-print_format', 'json', '-show_format', '-show_streams', fileUrl(input)];
}

/** Every video packet's pts, dts and flags: keyframes for copy cuts, read without decoding. */
export function videoPacketsArgs(input: string): string[] {
  return [...probeGuards(), '-select_streams', 'v:0', '-show_entries', 'packet=pts_time,dts_time,flags', '-of', 'csv=p=0', fileUrl(input)];
}

// ── Poster ───────────────────────────────────────────────────────────────────────────────────

/** A third of the way in (about when the ball is snapped in a snap clip), at most a minute; the middle of a short clip; the first frame of a very short one. */
export function choosePosterSeconds(durationSeconds: number): number {
  if (!Number.isFinite(durationSeconds) || durationSeconds < 1) return 0;
  if (durationSeconds < 3) return durationSeconds / 2;
  return Math.min(durationSeconds / 3, 60);
}

/** The size ffmpeg's `scale='trunc(min(iw,W)/2)*2':-2` gives (av_rescale rounds to nearest). */
export function fitWidth(display: { width: number; height: number }, maxWidth: number): { width: number; height: number } {
  const width = 2 * Math.trunc(Math.min(display.width, maxWidth) / 2);
  return { width, height: scaledEvenHeight(width, display) };
}

export function scaledEvenHeight(width: number, display: { width: number; height: number }): number {
  return 2 * Math.round((width * display.height) / (display.width * 2));
}

export interface PosterOptions extends CommandBase {
  output: string;
  atSeconds: number;
  maxWidth: number;
}

export function posterCommand(o: PosterOptions): FfmpegCommand {
  const at = checkNumber('atSeconds', o.atSeconds, { max: MAX_SECONDS });
  const maxWidth = checkNumber('maxWidth', o.maxWidth, { integer: true, min: 16, max: 7680 });
  return {
    globalOptions: globalOptions({ strict: o.strict }),
    // -ss before -i: a fast seek to the keyframe before, then ffmpeg decodes up to the exact time.
    inputs: [{ options: [...inputGuards(o.inputFormat), '-ss', formatSeconds(at)], url: fileUrl(o.input) }],
    outputOptions: [
      '-map', '0:v:0', '-an', '-sn', '-dn',
      '-frames:v', '1',
      '-vf', `scale='trunc(min(iw,${maxWidth})/2)*2':-2`,
      '-q:v', '3',
      // -update 1: the output name is a file name, never an image-sequence pattern ("%d").
      '-f', 'image2', '-update', '1',
    ],
    output: fileUrl(o.output),
    durationSeconds: null,
  };
}

// ── Scrub strip ──────────────────────────────────────────────────────────────────────────────

/** How the client maps a hover position to a tile: tile i shows the frame at i × intervalMs. */
export interface StripLayout {
  frames: number;
  columns: number;
  rows: number;
  intervalMs: number;
  tileWidth: number;
  tileHeight: number;
}

export interface StripOptions extends CommandBase {
  output: string;
  durationSeconds: number;
  frames: number;
  tileWidth: number;
  /** Display size from the probe (rotation applied), for the tile height. */
  display: { width: number; height: number };
}

export function stripCommand(o: StripOptions): { command: FfmpegCommand; layout: StripLayout } {
  const duration = checkNumber('durationSeconds', o.durationSeconds, { above: 0, max: MAX_SECONDS });
  const frames = checkNumber('frames', o.frames, { integer: true, min: 1, max: 100 });
  const tileWidth = checkNumber('tileWidth', o.tileWidth, { integer: true, min: 16, max: 640 });
  if (tileWidth % 2 !== 0) throw new RangeError(`tileWidth must be even, got ${tileWidth}`);
  checkNumber('display.width', o.display.width, { integer: true, min: 1 });
  checkNumber('display.height', o.display.height, { integer: true, min: 1 });
  const command: FfmpegCommand = {
    globalOptions: globalOptions({ strict: o.strict }),
    inputs: [{ options: inputGuards(o.inputFormat), url: fileUrl(o.input) }],
    outputOptions: [
      '-map', '0:v:0', '-an', '-sn', '-dn',
      '-vf', `fps=${frames}/${formatSeconds(duration)},scale=${tileWidth}:-2,tile=${frames}x1`,
      '-frames:v', '1',
      '-q:v', '5',
      '-f', 'image2', '-update', '1',
    ],
    output: fileUrl(o.output),
    durationSeconds: duration,
  };
  const layout: StripLayout = {
    frames,
    columns: frames,
    rows: 1,
    intervalMs: (duration * 1000) / frames,
    tileWidth,
    tileHeight: scaledEvenHeight(tileWidth, o.display),
  };
  return { command, layout };
}

// ── Web rendition ────────────────────────────────────────────────────────────────────────────

export type RenditionAction = 'skip' | 'remux' | 'transcode';
export interface RenditionPlan {
  action: RenditionAction;
  reason: string;
}

type PlanFacts = Pick<
  ProbeResult,
  'formatName' | 'majorBrand' | 'videoCodec' | 'audioCodec' | 'pixelFormat' | 'displayHeight' | 'hasVideo' | 'moovFirst'
>;

/**
 * skip: already an MP4 a browser plays at once (H.264 yuv420p, AAC or silent, small enough, moov
 * first); remux: those codecs in another container or with moov at the end (copy, no quality
 * loss); transcode: anything else.
 */
export function renditionPlan(probe: PlanFacts, options: { maxHeight: number }): RenditionPlan {
  const maxHeight = checkNumber('maxHeight', options.maxHeight, { integer: true, min: 144, max: 4320 });
  if (!probe.hasVideo) throw new RangeError('renditionPlan needs a video stream');
  if (probe.videoCodec !== 'h264') return { action: 'transcode', reason: `video codec ${probe.videoCodec ?? 'unknown'} is not H.264` };
  if (probe.pixelFormat !== 'yuv420p') return { action: 'transcode', reason: `pixel format ${probe.pixelFormat ?? 'unknown'} is not yuv420p` };
  if (probe.audioCodec !== null && probe.audioCodec !== 'aac') return { action: 'transcode', reason: `audio codec ${probe.audioCodec} is not AAC` };
  if (probe.displayHeight > maxHeight) return { action: 'transcode', reason: `height ${probe.displayHeight} is above ${maxHeight}` };
  if (!isMovFamily(probe.formatName)) return { action: 'remux', reason: `web codecs in a ${probe.formatName.split(',')[0]} container` };
  if (probe.majorBrand?.trim() === 'qt') return { action: 'remux', reason: 'web codecs in a QuickTime (.mov) file' };
  if (probe.moovFirst === false) return { action: 'remux', reason: 'moov box after the media data' };
  if (probe.moovFirst !== true) return { action: 'remux', reason: 'box order unknown' };
  return { action: 'skip', reason: 'already a web-playable MP4' };
}

const MP4_OUT = ['-movflags', '+faststart', '-f', 'mp4'];

/** Height at most maxHeight (a validated integer), never upscaled, even (yuv420p needs it); -2 keeps the aspect with an even width. */
function scaleToHeight(maxHeight: number): string {
  return `scale=-2:'trunc(min(ih,${maxHeight})/2)*2'`;
}
const DROP_EXTRAS = ['-sn', '-dn', '-map_metadata', '-1', '-map_chapters', '-1'];
const ENCODE_VIDEO = ['-c:v', WEB_VIDEO.codec, '-preset', WEB_VIDEO.preset, '-crf', String(WEB_VIDEO.crf), '-pix_fmt', WEB_VIDEO.pixelFormat];

export interface RenditionOptions extends CommandBase {
  output: string;
  plan: RenditionPlan;
  maxHeight?: number;
  durationSeconds?: number;
}

export function renditionCommand(o: RenditionOptions): FfmpegCommand {
  const maxHeight = checkNumber('maxHeight', o.maxHeight ?? 720, { integer: true, min: 144, max: 4320 });
  if (o.plan.action === 'skip') throw new RangeError('a skip plan has nothing to run');
  const video =
    o.plan.action === 'remux'
      ? ['-c', 'copy']
      : ['-vf', scaleToHeight(maxHeight), ...ENCODE_VIDEO, '-c:a', WEB_VIDEO.audioCodec];
  return {
    globalOptions: globalOptions({ strict: o.strict }),
    inputs: [{ options: inputGuards(o.inputFormat), url: fileUrl(o.input) }],
    outputOptions: ['-map', '0:v:0', '-map', '0:a:0?', ...DROP_EXTRAS, ...video, ...MP4_OUT],
    output: fileUrl(o.output),
    durationSeconds: o.durationSeconds === undefined ? null : checkNumber('durationSeconds', o.durationSeconds, { max: MAX_SECONDS }),
  };
}

/** Decodes everything and writes nothing: finds damage in files that skip or remux would not decode. */
export function decodeCheckCommand(o: Omit<CommandBase, 'strict'> & { durationSeconds?: number }): FfmpegCommand {
  return {
    globalOptions: globalOptions({ strict: true }),
    inputs: [{ options: inputGuards(o.inputFormat), url: fileUrl(o.input) }],
    outputOptions: ['-map', '0:v:0', '-map', '0:a:0?', '-sn', '-dn', '-f', 'null'],
    output: '-',
    durationSeconds: o.durationSeconds ?? null,
  };
}

// ── Scene detection ──────────────────────────────────────────────────────────────────────────

export interface SceneDetectOptions extends CommandBase {
  /** 0 < threshold < 1: how different two frames must be to count as a cut (0.3 is a common start). */
  threshold: number;
  durationSeconds?: number;
}

export function sceneDetectCommand(o: SceneDetectOptions): FfmpegCommand {
  const threshold = checkNumber('threshold', o.threshold, { above: 0, max: 0.99 });
  return {
    // showinfo reports at the info level.
    globalOptions: globalOptions({ strict: o.strict, logLevel: 'info' }),
    inputs: [{ options: inputGuards(o.inputFormat), url: fileUrl(o.input) }],
    outputOptions: ['-map', '0:v:0', '-an', '-sn', '-dn', '-vf', `select='gt(scene,${threshold})',showinfo`, '-f', 'null'],
    output: '-',
    durationSeconds: o.durationSeconds === undefined ? null : checkNumber('durationSeconds', o.durationSeconds, { max: MAX_SECONDS }),
  };
}

/**
 * Decodes up to the first error, printing one frame time every half second: the last time printed
 * says where the damage is (progress lines come by wall clock, far too coarse on fast decodes).
 */
export function locateDamageCommand(o: Omit<CommandBase, 'strict'>): FfmpegCommand {
  return {
    globalOptions: globalOptions({ strict: true, logLevel: 'info' }),
    inputs: [{ options: inputGuards(o.inputFormat), url: fileUrl(o.input) }],
    outputOptions: ['-map', '0:v:0', '-map', '0:a:0?', '-sn', '-dn', '-vf', "select='isnan(prev_selected_t)+gte(t-prev_selected_t,0.5)',showinfo", '-f', 'null'],
    output: '-',
    durationSeconds: null,
  };
}

/**
 * The times of the frames showinfo printed. pts × the filter's time base is exact; pts_time is
 * printed with six significant digits only (10 ms steps two hours in), so it is the fallback.
 * Not anchored to line starts: a progress line ending in \r can share a line with showinfo.
 */
export function parseShowinfoTimes(stderr: string): number[] {
  const base = /\[Parsed_showinfo_\d+ @ [^\]]*\] config in time_base: (\d+)\/(\d+)/.exec(stderr);
  const num = base ? Number(base[1]) : 0;
  const den = base ? Number(base[2]) : 0;
  const times: number[] = [];
  for (const m of stderr.matchAll(/\[Parsed_showinfo_\d+ @ [^\]]*\] n:\s*\d+\s+pts:\s*(-?\d+)\s+pts_time:(\S+)/g)) {
    const t = num > 0 && den > 0 ? (Number(m[1]) * num) / den : Number(m[2]);
    if (Number.isFinite(t) && t >= 0) times.push(t);
  }
  return [...new Set(times)].sort((a, b) => a - b);
}

/** Scene cuts are the frames `select` let through to showinfo. */
export const parseSceneTimes = parseShowinfoTimes;

// ── Cuts ─────────────────────────────────────────────────────────────────────────────────────

export type CutMode = 'copy' | 'encode';

export function keyframeTimes(packets: readonly VideoPacket[]): number[] {
  return packets.filter((p) => p.key).map((p) => p.pts).sort((a, b) => a - b);
}

/** The keyframe within half a frame of t, if any. */
export function nearestKeyframe(t: number, keyframes: readonly number[], fps: number): number | undefined {
  checkNumber('fps', fps, { above: 0, max: 1000 });
  const tolerance = 0.5 / fps;
  let lo = 0;
  let hi = keyframes.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (keyframes[mid]! < t) lo = mid + 1;
    else hi = mid;
  }
  const candidates = [keyframes[lo - 1], keyframes[lo]].filter((k): k is number => k !== undefined);
  const best = candidates.sort((a, b) => Math.abs(a - t) - Math.abs(b - t))[0];
  return best !== undefined && Math.abs(best - t) <= tolerance ? best : undefined;
}

/**
 * 'copy' (no re-encoding: fast, lossless) only if every cut point lands within half a frame of a
 * keyframe; a copied clip must start on one. Pass the interior cut points: the tape's start is
 * always a keyframe and its end needs none.
 */
export function chooseCutMode(cutTimes: readonly number[], keyframes: readonly number[], fps: number): CutMode {
  const sorted = [...keyframes].sort((a, b) => a - b);
  return cutTimes.every((t) => nearestKeyframe(checkNumber('cut time', t, { max: MAX_SECONDS }), sorted, fps) !== undefined) ? 'copy' : 'encode';
}

/**
 * How long to read video for a copied cut [start, end): ffmpeg's input -t stops stream copy by
 * decode time (dts), and with B-frames the next segment's keyframe is decoded before frames shown
 * earlier. The limit is put midway between the last dts shown inside the cut and the first dts of
 * a frame shown after it. null when those overlap (open GOP): the cut then needs encoding.
 */
export function copyReadSeconds(packets: readonly VideoPacket[], start: number, end: number, fps: number): { seconds: number; frames: number } | null {
  checkNumber('fps', fps, { above: 0, max: 1000 });
  const half = 0.5 / fps;
  const inside = packets.filter((p) => p.pts >= start - half && p.pts < end - half);
  if (inside.length === 0) return null;
  const after = packets.filter((p) => p.pts >= end - half);
  const lastInside = Math.max(...inside.map((p) => p.dts));
  const firstAfter = after.length > 0 ? Math.min(...after.map((p) => p.dts)) : lastInside + 2 / fps;
  if (firstAfter <= lastInside) return null;
  return { seconds: (lastInside + firstAfter) / 2 - start, frames: inside.length };
}

export interface CutOptions extends CommandBase {
  output: string;
  startSeconds: number;
  endSeconds: number;
  mode: CutMode;
  fps: number;
  /** copy only: from copyReadSeconds (start must be a keyframe's exact time). */
  copyVideoSeconds?: number;
  /** encode only: as in renditionCommand, default 720. */
  maxHeight?: number;
}

export function cutCommand(o: CutOptions): FfmpegCommand {
  const start = checkNumber('startSeconds', o.startSeconds, { max: MAX_SECONDS });
  const end = checkNumber('endSeconds', o.endSeconds, { above: start, max: MAX_SECONDS });
  const fps = checkNumber('fps', o.fps, { above: 0, max: 1000 });
  const url = fileUrl(o.input);
  const guards = inputGuards(o.inputFormat);
  if (o.mode === 'copy') {
    if (o.copyVideoSeconds === undefined) throw new RangeError('a copy cut needs copyVideoSeconds (see copyReadSeconds)');
    const videoSeconds = checkNumber('copyVideoSeconds', o.copyVideoSeconds, { above: 0, max: MAX_SECONDS });
    // The same file twice: video copied and limited by decode time, audio re-encoded (a few ms of
    // work) and trimmed exactly. One -t for both would cut the audio short by the B-frame delay.
    return {
      globalOptions: globalOptions({ strict: o.strict }),
      inputs: [
        { options: [...guards, '-ss', formatSeconds(start), '-t', formatSeconds(videoSeconds)], url },
        { options: [...guards, '-ss', formatSeconds(start), '-t', formatSeconds(end - start)], url },
      ],
      outputOptions: ['-map', '0:v:0', '-map', '1:a:0?', ...DROP_EXTRAS, '-c:v', 'copy', '-c:a', WEB_VIDEO.audioCodec, ...MP4_OUT],
      output: fileUrl(o.output),
      durationSeconds: end - start,
    };
  }
  // A quarter frame earlier on both ends: cut times read back from ffmpeg are rounded, and the
  // frame shown exactly at `start` must be kept while the one at `end` must not.
  const guard = 0.25 / fps;
  const from = Math.max(0, start - guard);
  const maxHeight = checkNumber('maxHeight', o.maxHeight ?? 720, { integer: true, min: 144, max: 4320 });
  return {
    globalOptions: globalOptions({ strict: o.strict }),
    inputs: [{ options: [...guards, '-ss', formatSeconds(from)], url }],
    outputOptions: [
      '-t', formatSeconds(end - guard - from),
      '-map', '0:v:0', '-map', '0:a:0?', ...DROP_EXTRAS, '-vf', scaleToHeight(maxHeight), ...ENCODE_VIDEO, '-c:a', WEB_VIDEO.audioCodec, ...MP4_OUT,
    ],
    output: fileUrl(o.output),
    durationSeconds: end - start,
  };
}
