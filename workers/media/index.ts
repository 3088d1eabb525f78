/**
 * Media processing for the worker: probe, poster, scrub strip, web rendition, scene cuts, cutting.
 * Every function takes local file paths (absolute); the job handler downloads the upload from S3
 * into a per-job directory from withTempDir, calls these, uploads the results, and the directory
 * is removed whatever happens. Failures a coach should see are MediaError: show `reason`, log
 * `detail`, and do not retry when `permanent` is true. Anything else thrown is a bug or an outage.
 *
 *   configureMedia({ ffmpegPath?, ffprobePath?, timeoutMs? })          once at worker start
 *   withTempDir(async (dir) => …)                                       per job
 *   probeMedia(path)                         → ProbeResult              checks before anything else
 *   makePoster(input, output.jpg, { maxWidth = 1280, atSeconds? })  → { atSeconds, width, height }
 *   makeStrip(input, output.jpg, { frames = 10, tileWidth = 160 }) → StripLayout (hover → tile)
 *   makeRendition(input, output.mp4, { maxHeight = 720 })   → { plan, written } (written false on skip:
 *                                                                serve the original)
 *   detectScenes(input, threshold = 0.3)     → seconds[] of proposed cuts
 *   readVideoPackets(input) / keyframeTimes(packets) / chooseCutMode(cuts, keyframes, fps)
 *   cutSegment(input, output.mp4, { startSeconds, endSeconds, mode = 'auto', maxHeight = 720 }) → { mode }
 *   verifyDecodable(input)                   decodes all, throws MediaError 'damaged' with the time
 *
 * Every step accepts { info?: ProbeResult (skip re-probing), timeoutMs? (per ffmpeg/ffprobe run;
 * default 5 min), onProgress?, onStart?, tolerateDamage? }. Steps are strict by default: a decoding
 * error fails the step with "stream unreadable near m:ss"; tolerateDamage lets ffmpeg conceal it.
 * A RangeError means the caller passed a bad argument (e.g. a threshold outside 0–1): validate first.
 */
import { stat } from 'node:fs/promises';
import {
  chooseCutMode,
  choosePosterSeconds,
  copyReadSeconds,
  cutCommand,
  decodeCheckCommand,
  fitWidth,
  keyframeTimes,
  locateDamageCommand,
  nearestKeyframe,
  parseSceneTimes,
  parseShowinfoTimes,
  posterCommand,
  renditionCommand,
  renditionPlan,
  sceneDetectCommand,
  stripCommand,
  videoPacketsArgs,
  type CutMode,
  type FfmpegCommand,
  type RenditionPlan,
  type StripLayout,
} from './ffmpeg-commands';
import { probe, run, runProbe, setFfmpegPath, setFfprobePath } from './ffmpeg-runner';
import { MediaError, REASONS, isMediaError, mediaErrorFromStderr } from './media-error';
import { readBoxLayout } from './mp4-boxes';
import { parseVideoPackets, type ProbeResult, type VideoPacket } from './probe-result';

export { MediaError, isMediaError, type MediaErrorCode } from './media-error';
export { withTempDir } from './temp-dir';
export { chooseCutMode, keyframeTimes, renditionPlan, type CutMode, type RenditionPlan, type StripLayout } from './ffmpeg-commands';
export type { ProbeResult, VideoPacket } from './probe-result';
export { setFfmpegPath, setFfprobePath };

export const DEFAULT_TIMEOUT_MS = 5 * 60_000;
/** Beyond 8K (8192×4320) decoding, filtering and encoding buffers outgrow what a worker should risk on an upload. */
export const MAX_PIXELS = 8192 * 4320;

let defaultTimeoutMs = DEFAULT_TIMEOUT_MS;

export function configureMedia(options: { ffmpegPath?: string; ffprobePath?: string; timeoutMs?: number }): void {
  if (options.ffmpegPath) setFfmpegPath(options.ffmpegPath);
  if (options.ffprobePath) setFfprobePath(options.ffprobePath);
  if (options.timeoutMs !== undefined) {
    if (!(options.timeoutMs > 0)) throw new RangeError('timeoutMs must be positive');
    defaultTimeoutMs = options.timeoutMs;
  }
}

export interface StepOptions {
  /** The source's probe, when the caller already has it. */
  info?: ProbeResult;
  timeoutMs?: number;
  onProgress?: (fraction: number) => unknown;
  onStart?: (pid: number, commandLine: string) => void;
  /** Let ffmpeg conceal decoding errors instead of failing the step. */
  tolerateDamage?: boolean;
}

/**
 * Size, stream and container checks, then ffprobe: rejects empty, cut-short, non-video,
 * audio-only and oversized files with a MediaError before any decoding starts.
 */
export async function probeMedia(path: string, options: Pick<StepOptions, 'timeoutMs'> = {}): Promise<ProbeResult> {
  const stats = await stat(path);
  if (!stats.isFile()) throw new Error(`not a regular file: ${path}`);
  if (stats.size === 0) throw new MediaError('empty', REASONS.empty);
  const boxes = await readBoxLayout(path);
  if (boxes.isMp4 && boxes.truncated) throw new MediaError('truncated', REASONS.truncated, `top-level boxes: ${boxes.boxes.map((b) => b.type).join(' ')}`);
  const info = await probe(path, { timeoutMs: options.timeoutMs ?? defaultTimeoutMs, failureContext: { looksLikeMp4: boxes.isMp4 } });
  if (!info.hasVideo) {
    if (info.hasAudio) throw new MediaError('audio_only', REASONS.audio_only);
    throw new MediaError(boxes.isMp4 ? 'truncated' : 'not_video', boxes.isMp4 ? REASONS.truncated : REASONS.not_video, `format ${info.formatName}, no streams`);
  }
  if (info.width <= 0 || info.height <= 0) throw new MediaError('not_video', REASONS.not_video, 'video stream without a size');
  if (info.width * info.height > MAX_PIXELS) throw new MediaError('too_large', `the picture is too large (${info.width}×${info.height}, above 8K)`);
  return { ...info, moovFirst: boxes.moovFirst };
}

export async function makePoster(
  input: string,
  output: string,
  options: StepOptions & { atSeconds?: number; maxWidth?: number } = {},
): Promise<{ atSeconds: number; width: number; height: number }> {
  const info = options.info ?? (await probeMedia(input, options));
  const atSeconds = options.atSeconds ?? choosePosterSeconds(info.durationMs / 1000);
  const maxWidth = options.maxWidth ?? 1280;
  await execute(posterCommand({ input, inputFormat: info.formatName, output, atSeconds, maxWidth, strict: !options.tolerateDamage }), options, { input, inputFormat: info.formatName });
  await ensureWritten(output, 'no picture could be taken from the video');
  return { atSeconds, ...fitWidth({ width: info.displayWidth, height: info.displayHeight }, maxWidth) };
}

export async function makeStrip(input: string, output: string, options: StepOptions & { frames?: number; tileWidth?: number } = {}): Promise<StripLayout> {
  const info = options.info ?? (await probeMedia(input, options));
  const { command, layout } = stripCommand({
    input,
    inputFormat: info.formatName,
    output,
    durationSeconds: durationSeconds(info),
    frames: options.frames ?? 10,
    tileWidth: options.tileWidth ?? 160,
    display: { width: info.displayWidth, height: info.displayHeight },
    strict: !options.tolerateDamage,
  });
  await execute(command, options, { input, inputFormat: info.formatName });
  await ensureWritten(output, 'no scrub strip could be made from the video');
  return layout;
}

/**
 * The MP4 the player streams. On `skip` nothing is written (serve the original); skip and remux do
 * not decode, so unless damage is tolerated the file is decoded once first to find damage.
 */
export async function makeRendition(input: string, output: string, options: StepOptions & { maxHeight?: number } = {}): Promise<{ plan: RenditionPlan; written: boolean }> {
  const info = options.info ?? (await probeMedia(input, options));
  const maxHeight = options.maxHeight ?? 720;
  const plan = renditionPlan(info, { maxHeight });
  if (plan.action !== 'transcode' && !options.tolerateDamage) await verifyDecodable(input, { ...options, info, onProgress: undefined });
  if (plan.action === 'skip') return { plan, written: false };
  await execute(
    renditionCommand({ input, inputFormat: info.formatName, output, plan, maxHeight, durationSeconds: durationSeconds(info), strict: !options.tolerateDamage }),
    options,
    { input, inputFormat: info.formatName },
  );
  await ensureWritten(output, 'no web version could be made from the video');
  return { plan, written: true };
}

/** Decodes the whole file; throws MediaError 'damaged' ("stream unreadable near m:ss") on the first error. */
export async function verifyDecodable(input: string, options: StepOptions = {}): Promise<void> {
  const info = options.info ?? (await probeMedia(input, options));
  await execute(decodeCheckCommand({ input, inputFormat: info.formatName, durationSeconds: durationSeconds(info) }), options, { input, inputFormat: info.formatName });
}

/** Proposed cut times in seconds from the start of the file, ascending. */
export async function detectScenes(input: string, threshold = 0.3, options: StepOptions = {}): Promise<number[]> {
  const info = options.info ?? (await probeMedia(input, options));
  const stderr = await execute(
    sceneDetectCommand({ input, inputFormat: info.formatName, threshold, durationSeconds: durationSeconds(info), strict: !options.tolerateDamage }),
    options,
    { input, inputFormat: info.formatName },
  );
  return parseSceneTimes(stderr);
}

/** Every video packet (pts, dts, keyframe flag) on ffmpeg's timeline, read without decoding. */
export async function readVideoPackets(input: string, options: StepOptions = {}): Promise<VideoPacket[]> {
  const info = options.info ?? (await probeMedia(input, options));
  const csv = await runProbe(videoPacketsArgs(input), { timeoutMs: options.timeoutMs ?? defaultTimeoutMs });
  return parseVideoPackets(csv, info.startMs / 1000);
}

/**
 * One snap out of a tape. 'copy' keeps the video as is (fast, exact only on keyframes; the audio
 * is re-encoded to trim it exactly); 'encode' re-encodes to the web format (at most maxHeight,
 * default 720); 'auto' (the default) copies when the source is already web-playable and both ends
 * fall on keyframes (see chooseCutMode), and encodes otherwise.
 */
export async function cutSegment(
  input: string,
  output: string,
  options: StepOptions & { startSeconds: number; endSeconds: number; mode?: CutMode | 'auto'; packets?: VideoPacket[]; maxHeight?: number },
): Promise<{ mode: CutMode }> {
  const info = options.info ?? (await probeMedia(input, options));
  if (!(info.fps > 0 && info.fps <= 1000)) throw new MediaError('failed', REASONS.failed, `frame rate unknown or implausible: ${info.fps}`);
  const maxHeight = options.maxHeight ?? 720;
  // 'auto' copies only what a browser can play as it is; anything else is encoded to the web format.
  const webReady = renditionPlan(info, { maxHeight }).action !== 'transcode';
  const requested = options.mode === undefined || options.mode === 'auto' ? (webReady ? 'auto' : 'encode') : options.mode;
  let { startSeconds, endSeconds } = options;
  let mode: CutMode = requested === 'copy' ? 'copy' : 'encode';
  let copyVideoSeconds: number | undefined;
  if (requested !== 'encode') {
    const packets = options.packets ?? (await readVideoPackets(input, { ...options, info }));
    const keyframes = keyframeTimes(packets);
    const duration = durationSeconds(info);
    const half = 0.5 / info.fps;
    // The end of the tape needs no keyframe; every other cut point does.
    const points = [startSeconds, endSeconds].filter((t) => t > half && t < duration - half);
    const read = chooseCutMode(points, keyframes, info.fps) === 'copy' ? alignedCopy(packets, keyframes, startSeconds, endSeconds, duration, info.fps) : null;
    if (read) {
      mode = 'copy';
      ({ startSeconds, endSeconds, copyVideoSeconds } = read);
    } else if (requested === 'copy') {
      throw new RangeError('copy cut requested but the cut points are not on keyframes; use mode "encode" or "auto"');
    } else {
      mode = 'encode';
    }
  }
  await execute(
    cutCommand({ input, inputFormat: info.formatName, output, startSeconds, endSeconds, mode, fps: info.fps, copyVideoSeconds, maxHeight, strict: !options.tolerateDamage }),
    options,
    { input, inputFormat: info.formatName },
  );
  await ensureWritten(output, 'no clip could be cut from the video');
  return { mode };
}

function alignedCopy(packets: VideoPacket[], keyframes: number[], start: number, end: number, duration: number, fps: number) {
  const half = 0.5 / fps;
  // Snap to the keyframes' exact times: a start a hair before the keyframe would seek a whole GOP back.
  const from = start <= half ? (keyframes[0] ?? 0) : nearestKeyframe(start, keyframes, fps);
  const atEnd = end >= duration - half;
  const to = atEnd ? Number.POSITIVE_INFINITY : nearestKeyframe(end, keyframes, fps);
  if (from === undefined || to === undefined) return null;
  const read = copyReadSeconds(packets, from, to, fps);
  return read ? { startSeconds: from, endSeconds: atEnd ? duration : to, copyVideoSeconds: read.seconds } : null;
}

function durationSeconds(info: ProbeResult): number {
  if (info.durationMs > 0) return info.durationMs / 1000;
  if (info.frameCount && info.fps > 0) return info.frameCount / info.fps;
  throw new MediaError('failed', REASONS.failed, 'duration unknown');
}

async function execute(command: FfmpegCommand, options: StepOptions, source?: { input: string; inputFormat: string }): Promise<string> {
  const timeoutMs = options.timeoutMs ?? defaultTimeoutMs;
  try {
    return await run(command, { timeoutMs, onProgress: options.onProgress, onStart: options.onStart });
  } catch (error) {
    if (source && isMediaError(error) && error.code === 'damaged') throw await locateDamage(source, timeoutMs, error);
    throw error;
  }
}

/** A second, slower decode that prints frame times, to say where the damage is. */
async function locateDamage(source: { input: string; inputFormat: string }, timeoutMs: number, original: MediaError): Promise<MediaError> {
  try {
    await run(locateDamageCommand(source), { timeoutMs });
    return original; // decodes cleanly on its own: keep what the first run said
  } catch (error) {
    if (!isMediaError(error) || error.code !== 'damaged') return original;
    const times = parseShowinfoTimes(error.stderr);
    const near = times.length > 0 ? times[times.length - 1] : undefined;
    return near === undefined ? original : mediaErrorFromStderr(original.stderr, { nearSeconds: near });
  }
}

/** ffmpeg exits 0 with "Output file is empty" when no frame qualified (e.g. a time past the end). */
async function ensureWritten(path: string, reason: string): Promise<void> {
  const size = await stat(path).then((s) => s.size, () => 0);
  if (size === 0) throw new MediaError('failed', reason, `${path} missing or empty after ffmpeg`);
}
