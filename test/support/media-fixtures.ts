/**
 * Test video made on the spot with ffmpeg's lavfi sources: no real footage, small files, each in
 * well under a second. Also the bad uploads the worker must turn into a clear reason.
 */
import { execFile } from 'node:child_process';
import { readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { promisify } from 'node:util';

const exec = promisify(execFile);
export const FFMPEG = process.env.FFMPEG_PATH ?? '/usr/bin/ffmpeg';
export const FFPROBE = process.env.FFPROBE_PATH ?? '/usr/bin/ffprobe';

/** Pictures ffmpeg can draw; the scene tests need them to look unlike each other. */
export type LavfiSource = 'testsrc2' | 'testsrc' | 'smptebars' | 'smptehdbars' | 'mandelbrot' | 'rgbtestsrc' | `color=c=${string}`;

export interface ClipSpec {
  seconds: number;
  width?: number;
  height?: number;
  fps?: number;
  audio?: boolean;
  source?: LavfiSource;
  container?: 'mp4' | 'mkv' | 'mov';
  videoCodec?: 'libx264' | 'mpeg4';
  pixelFormat?: 'yuv420p' | 'yuv422p';
  /** MP4/MOV: moov before mdat. Default true. */
  faststart?: boolean;
  /** Clockwise degrees a player turns the picture (a phone held upright records 90). */
  rotation?: 0 | 90 | 180 | 270;
  /** Keyframe interval in frames. */
  gop?: number;
  name?: string;
}

export async function ffmpeg(args: string[]): Promise<void> {
  await exec(FFMPEG, ['-nostdin', '-hide_banner', '-loglevel', 'error', '-y', ...args], { maxBuffer: 64 * 1024 * 1024 });
}

export async function ffprobeJson(path: string, extra: string[] = ['-show_format', '-show_streams']): Promise<any> {
  const { stdout } = await exec(FFPROBE, ['-v', 'error', '-print_format', 'json', ...extra, path], { maxBuffer: 64 * 1024 * 1024 });
  return JSON.parse(stdout);
}

export function lavfi(source: LavfiSource, width: number, height: number, fps: number): string {
  const joiner = source.includes('=') ? ':' : '=';
  return `${source}${joiner}s=${width}x${height}:r=${fps}`;
}

let counter = 0;

export async function makeClip(dir: string, spec: ClipSpec): Promise<string> {
  const { seconds, width = 320, height = 240, fps = 30, audio = false, source = 'testsrc2', container = 'mp4' } = spec;
  const frames = Math.max(1, Math.round(seconds * fps));
  const path = join(dir, spec.name ?? `clip-${++counter}.${container}`);
  const rotation = spec.rotation ?? 0;
  const target = rotation ? join(dir, `unrotated-${++counter}.${container}`) : path;
  await ffmpeg([
    '-f', 'lavfi', '-i', lavfi(source, width, height, fps),
    ...(audio ? ['-f', 'lavfi', '-i', 'sine=frequency=440:sample_rate=48000'] : []),
    '-frames:v', String(frames),
    ...(audio ? ['-t', String(frames / fps)] : []),
    '-c:v', spec.videoCodec ?? 'libx264',
    ...((spec.videoCodec ?? 'libx264') === 'libx264' ? ['-preset', 'ultrafast'] : ['-q:v', '4']),
    '-pix_fmt', spec.pixelFormat ?? 'yuv420p',
    ...(spec.gop ? ['-g', String(spec.gop)] : []),
    ...(audio ? ['-c:a', 'aac'] : []),
    ...(container !== 'mkv' && spec.faststart !== false ? ['-movflags', '+faststart'] : []),
    target,
  ]);
  if (rotation) {
    // ffmpeg 5.1 writes the `rotate` tag into the display matrix counter-clockwise (a phone's
    // clockwise 90 is "rotate=270" here; ffprobe then reports the phone's usual -90).
    await ffmpeg(['-i', target, '-map', '0', '-c', 'copy', '-metadata:s:v:0', `rotate=${(360 - rotation) % 360}`, ...(spec.faststart !== false ? ['-movflags', '+faststart'] : []), path]);
  }
  return path;
}

export interface TapeSegment {
  seconds: number;
  source: LavfiSource;
}

export interface Tape {
  path: string;
  /** The true cut times in seconds (frame-exact: frames before the cut ÷ fps). */
  cuts: number[];
  durationSeconds: number;
  fps: number;
}

/**
 * Visually distinct segments joined into one continuous "game tape". With keyframesAtCuts every cut
 * starts a GOP (copy cuts possible); without, keyframes only every `gop` frames and no scene-cut
 * keyframes, so cuts fall between keyframes.
 */
export async function makeTape(
  dir: string,
  segments: TapeSegment[],
  options: { width?: number; height?: number; fps?: number; audio?: boolean; keyframesAtCuts?: boolean; gop?: number; name?: string } = {},
): Promise<Tape> {
  const { width = 320, height = 240, fps = 30, audio = true, keyframesAtCuts = true, gop = 300 } = options;
  const frames = segments.map((s) => Math.max(1, Math.round(s.seconds * fps)));
  const cuts: number[] = [];
  let total = 0;
  for (const n of frames.slice(0, -1)) {
    total += n;
    cuts.push(total / fps);
  }
  total += frames[frames.length - 1]!;
  const inputs = segments.flatMap((s) => ['-f', 'lavfi', '-i', lavfi(s.source, width, height, fps)]);
  const chains = segments.map((_, i) => `[${i}:v]trim=end_frame=${frames[i]},setpts=PTS-STARTPTS,format=yuv420p[v${i}]`);
  const graph = `${chains.join(';')};${segments.map((_, i) => `[v${i}]`).join('')}concat=n=${segments.length}:v=1:a=0[v]`;
  const path = join(dir, options.name ?? `tape-${++counter}.mp4`);
  await ffmpeg([
    ...inputs,
    ...(audio ? ['-f', 'lavfi', '-i', 'sine=frequency=220:sample_rate=48000'] : []),
    '-filter_complex', graph,
    '-map', '[v]',
    ...(audio ? ['-map', `${segments.length}:a`, '-t', String(total / fps), '-c:a', 'aac'] : []),
    // veryfast, like our renditions and most cameras, uses B-frames: copy cuts must cope with them.
    '-c:v', 'libx264', '-preset', 'veryfast', '-pix_fmt', 'yuv420p',
    '-g', String(gop),
    ...(keyframesAtCuts ? ['-force_key_frames', cuts.map((c) => c.toFixed(6)).join(',')] : ['-sc_threshold', '0']),
    '-movflags', '+faststart',
    path,
  ]);
  return { path, cuts, durationSeconds: total / fps, fps };
}

/** Deterministic bytes (xorshift32), so a "random" file is the same on every run. */
export function pseudoRandomBytes(length: number, seed = 0x2545f491): Buffer {
  const out = Buffer.alloc(length);
  let x = seed >>> 0 || 1;
  for (let i = 0; i < length; i += 1) {
    x ^= x << 13;
    x >>>= 0;
    x ^= x >>> 17;
    x ^= x << 5;
    x >>>= 0;
    out[i] = x & 0xff;
  }
  return out;
}

export interface BadFiles {
  pngAsMp4: string;
  textAsMp4: string;
  empty: string;
  /** First 30% of an MP4 whose moov is at the end: no moov at all. */
  truncated: string;
  /** First 30% of a faststart MP4: moov complete, media data cut. */
  truncatedFaststart: string;
  headerOnly: string;
  audioOnly: string;
  randomBytes: string;
  corruptMiddle: string;
  /** An HLS playlist named .mp4 that would read a local file if its demuxer were allowed. */
  hlsPlaylist: string;
  /** A concat-demuxer script named .mp4. */
  concatScript: string;
}

export interface AwkwardFiles {
  /** A valid clip whose name has backslashes, "..", a leading dash, control characters and quotes. */
  strangeName: string;
  oneFrame: string;
  /** 3840×2160, a few frames: the rendition must come down to 720. */
  uhd: string;
  /** Coded 320×180, shown as 180×320: a phone held upright. */
  rotated: string;
  /** Variable frame rate: 30 fps for the first second, then 10 fps. */
  vfr: string;
}

export async function makeBadFiles(dir: string): Promise<BadFiles> {
  const p = (name: string) => join(dir, name);
  const movEnd = await makeClip(dir, { seconds: 3, audio: true, faststart: false, name: 'source-moov-end.mp4' });
  const movFront = await makeClip(dir, { seconds: 3, audio: true, name: 'source-faststart.mp4' });
  const whole = await readFile(movEnd);
  const front = await readFile(movFront);
  await ffmpeg(['-f', 'lavfi', '-i', 'testsrc2=s=64x64', '-frames:v', '1', p('picture.png')]);
  await writeFile(p('picture.mp4'), await readFile(p('picture.png')));
  await writeFile(p('notes.mp4'), 'Ironvale Anvils practice notes\nInside zone, tite front.\n');
  await writeFile(p('empty.mp4'), Buffer.alloc(0));
  await writeFile(p('truncated.mp4'), whole.subarray(0, Math.floor(whole.length * 0.3)));
  await writeFile(p('truncated-faststart.mp4'), front.subarray(0, Math.floor(front.length * 0.3)));
  await writeFile(p('header-only.mp4'), front.subarray(0, 64));
  await ffmpeg(['-f', 'lavfi', '-i', 'sine=frequency=330:duration=2', '-c:a', 'aac', p('voice.m4a')]);
  await writeFile(p('noise.mp4'), pseudoRandomBytes(200_000));
  const corrupt = Buffer.from(front);
  const middle = Math.floor(corrupt.length / 2);
  pseudoRandomBytes(8192, 7).copy(corrupt, middle);
  await writeFile(p('corrupt-middle.mp4'), corrupt);
  await writeFile(p('playlist.mp4'), '#EXTM3U\n#EXT-X-TARGETDURATION:10\n#EXTINF:10,\nfile:///etc/passwd\n#EXT-X-ENDLIST\n');
  await writeFile(p('concat.mp4'), "ffconcat version 1.0\nfile '/etc/passwd'\n");
  return {
    pngAsMp4: p('picture.mp4'),
    textAsMp4: p('notes.mp4'),
    empty: p('empty.mp4'),
    truncated: p('truncated.mp4'),
    truncatedFaststart: p('truncated-faststart.mp4'),
    headerOnly: p('header-only.mp4'),
    audioOnly: p('voice.m4a'),
    randomBytes: p('noise.mp4'),
    corruptMiddle: p('corrupt-middle.mp4'),
    hlsPlaylist: p('playlist.mp4'),
    concatScript: p('concat.mp4'),
  };
}

export const STRANGE_NAME = "-y ..\\..\\clip\n\t\u0001'\"$(id) ;|*?.mp4";

export async function makeAwkwardFiles(dir: string): Promise<AwkwardFiles> {
  const strangeName = await makeClip(dir, { seconds: 2, audio: true, name: STRANGE_NAME });
  const oneFrame = await makeClip(dir, { seconds: 1 / 30, name: 'one-frame.mp4' });
  const uhd = await makeClip(dir, { seconds: 0.5, fps: 10, width: 3840, height: 2160, source: 'smptehdbars', audio: true, name: 'uhd.mp4' });
  const rotated = await makeClip(dir, { seconds: 2, width: 320, height: 180, audio: true, rotation: 90, name: 'phone.mp4' });
  const vfr = join(dir, 'vfr.mp4');
  await ffmpeg([
    '-f', 'lavfi', '-i', lavfi('testsrc2', 320, 240, 30),
    '-vf', "select='lt(n\\,30)+not(mod(n\\,3))'", '-fps_mode', 'vfr', '-frames:v', '40',
    '-c:v', 'libx264', '-preset', 'ultrafast', '-pix_fmt', 'yuv420p', '-movflags', '+faststart', vfr,
  ]);
  return { strangeName, oneFrame, uhd, rotated, vfr };
}
