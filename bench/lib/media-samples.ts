import { execFile } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { createWriteStream, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { once } from 'node:events';
import { promisify } from 'node:util';

const exec = promisify(execFile);
export const FFMPEG = process.env.FFMPEG_PATH || '/usr/bin/ffmpeg';

async function ffmpeg(args: string[]): Promise<void> {
  await exec(FFMPEG, ['-nostdin', '-hide_banner', '-loglevel', 'error', '-y', ...args], { maxBuffer: 16 * 1024 * 1024 });
}

/**
 * An upload of `bytes` bytes that passes the server's content check: a real one-second MP4 made
 * with ffmpeg's test source (so the first bytes are a genuine ftyp/moov), then filler. Written to
 * disk in 1 MiB blocks, never held whole in memory. The worker would fail it later; the upload
 * benchmark only measures the upload.
 */
export async function makeUploadFile(dir: string, bytes: number, name = `upload-${bytes}.mp4`): Promise<string> {
  const seed = join(dir, 'seed.mp4');
  await ffmpeg(['-f', 'lavfi', '-i', 'testsrc2=s=320x240:r=30', '-frames:v', '30', '-c:v', 'libx264', '-preset', 'ultrafast', '-pix_fmt', 'yuv420p', '-movflags', '+faststart', seed]);
  const path = join(dir, name);
  const out = createWriteStream(path);
  const header = readFileSync(seed);
  if (header.length > bytes) throw new RangeError(`an upload of ${bytes} bytes cannot hold the ${header.length}-byte clip`);
  out.write(header);
  const block = randomBytes(1024 * 1024);
  let left = bytes - header.length;
  while (left > 0) {
    const piece = left >= block.length ? block : block.subarray(0, left);
    left -= piece.length;
    if (!out.write(piece)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
  if (statSync(path).size !== bytes) throw new Error(`${path} came out at ${statSync(path).size} bytes, not ${bytes}`);
  return path;
}

export interface BenchClipSpec {
  seconds: number;
  /** h264: the common phone/camera case; mpeg4: MPEG-4 Part 2, which the worker must transcode. */
  codec: 'h264' | 'mpeg4';
  /** Default false: moov after mdat, as many cameras write it (the worker then remuxes H.264). */
  faststart?: boolean;
}

/** A 1280×720 30 fps clip with AAC sound from ffmpeg's test sources: no real footage. */
export async function makeBenchClip(dir: string, spec: BenchClipSpec): Promise<string> {
  const frames = Math.round(spec.seconds * 30);
  const path = join(dir, `${spec.codec}-${spec.seconds}s${spec.faststart ? '-faststart' : ''}.mp4`);
  await ffmpeg([
    '-f', 'lavfi', '-i', 'testsrc2=s=1280x720:r=30',
    '-f', 'lavfi', '-i', 'sine=frequency=440:sample_rate=48000',
    '-frames:v', String(frames), '-t', String(frames / 30),
    ...(spec.codec === 'h264' ? ['-c:v', 'libx264', '-preset', 'veryfast', '-pix_fmt', 'yuv420p'] : ['-c:v', 'mpeg4', '-q:v', '4']),
    '-c:a', 'aac', '-b:a', '128k',
    ...(spec.faststart ? ['-movflags', '+faststart'] : []),
    path,
  ]);
  return path;
}
