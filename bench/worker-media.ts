/**
 * Worker time per clip (workers/media) vs the bare ffmpeg commands (issue 3).
 *
 *   node --import tsx bench/worker-media.ts [--quick]
 *
 * For a generated 1280×720 30 fps clip with AAC and the moov box at the end, in H.264 (the worker
 * remuxes it) and in MPEG-4 Part 2 (the worker transcodes it), each step is timed three ways:
 *   module    makePoster / makeStrip / makeRendition, called as the worker calls them (probe
 *             passed in, STRIP_FRAMES and RENDITION_MAX_HEIGHT defaults from server/core/config)
 *   same      execFile(ffmpeg, toArgs(…)) with the commands the module builds (the pure builders in
 *             workers/media/ffmpeg-commands.ts); the module's own command lines are checked to be
 *             these, so the ratio is the module's overhead, not different work
 *   textbook  the plain recipes of STACK.md (poster `-ss T -i in -frames:v 1`, strip
 *             `fps=…,scale=160:-2,tile=Nx1`, rendition libx264 veryfast crf 23 yuv420p aac +faststart)
 * Each is repeated (quick 3, full 7; the order rotates every repeat) and the medians compared.
 * makeRendition decodes the whole file before a remux or skip to find damage (verifyDecodable);
 * for H.264 the "same" baseline therefore runs that decode check and the remux, and a separate line
 * compares with the remux alone.
 */
import { execFile } from 'node:child_process';
import { rm } from 'node:fs/promises';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { loadConfig } from '../server/core/config';
import {
  choosePosterSeconds,
  decodeCheckCommand,
  formatSeconds,
  posterCommand,
  probeArgs,
  renditionCommand,
  renditionPlan,
  stripCommand,
  toArgs,
  type FfmpegCommand,
} from '../workers/media/ffmpeg-commands';
import { configureMedia, makePoster, makeRendition, makeStrip, probeMedia, withTempDir, type ProbeResult } from '../workers/media/index';
import { ratioOf, type BenchOptions, type BenchResult } from './lib/bench-result';
import { progress, runCli } from './lib/bench-cli';
import { formatNumber } from './lib/bench-table';
import { cleanUpOnInterrupt } from './lib/interrupt';
import { makeBenchClip } from './lib/media-samples';
import { median, timed } from './lib/stats';

const exec = promisify(execFile);

type Step = 'probe' | 'poster' | 'strip' | 'rendition';

/** fluent-ffmpeg's capability check happens once per process: only the first run here sees it. */
let firstFluentCallSeen = false;

/** One way of doing a step: `run` does it once, writing into `out` (a file name prefix). */
interface Contender {
  label: string;
  run: (out: string) => Promise<unknown>;
}

export async function run(options: BenchOptions): Promise<BenchResult[]> {
  // Only the media settings are read: the worker's defaults unless the environment overrides them.
  const config = loadConfig();
  configureMedia({ ffmpegPath: config.ffmpegPath, ffprobePath: config.ffprobePath, timeoutMs: config.media.timeoutMs });
  const seconds = options.quick ? 3 : 10;
  const repeats = options.quick ? 3 : 7;
  const media = { ffmpeg: config.ffmpegPath, ffprobe: config.ffprobePath, stripFrames: config.media.stripFrames, maxHeight: config.media.renditionMaxHeight };

  return withTempDir(
    async (dir) => {
      const release = cleanUpOnInterrupt('the media benchmark', () => rm(dir, { recursive: true, force: true }));
      try {
        return await measureAll(dir, seconds, repeats, media);
      } finally {
        release();
      }
    },
    { prefix: 'trenchwork-bench-media-' },
  );
}

async function measureAll(dir: string, seconds: number, repeats: number, media: MediaSettings): Promise<BenchResult[]> {
  progress(`making ${seconds} s 1280×720 test clips (H.264 and MPEG-4 Part 2, AAC, moov at the end)`);
  const clips = { h264: await makeBenchClip(dir, { seconds, codec: 'h264' }), mpeg4: await makeBenchClip(dir, { seconds, codec: 'mpeg4' }) };
  const results: BenchResult[] = [];

  // The first call in a process pays fluent-ffmpeg's one-off capability check (it runs
  // `ffmpeg -formats` and `-encoders` once and caches them); a worker pays it once per start.
  const info0 = await probeMedia(clips.h264);
  const sameFirst = posterContenders(clips.h264, info0, media).find((c) => c.label === 'same')!;
  const directFirst = await timed(() => sameFirst.run(join(dir, 'first-direct')));
  const moduleFirst = await timed(() => makePoster(clips.h264, join(dir, 'first-module.jpg'), { info: info0 }));
  const cold = !firstFluentCallSeen;
  firstFluentCallSeen = true;

  const perVariant: Record<string, Record<string, Record<string, number>>> = {};
  for (const [variant, clip] of Object.entries(clips)) {
    const info = await probeMedia(clip);
    const plan = renditionPlan(info, { maxHeight: media.maxHeight });
    progress(`${variant}: ${info.videoCodec} ${info.width}×${info.height}, ${(info.durationMs / 1000).toFixed(1)} s, rendition plan ${plan.action} (${plan.reason})`);
    const steps: [Step, Contender[]][] = [
      ['probe', probeContenders(clip, media)],
      ['poster', posterContenders(clip, info, media)],
      ['strip', stripContenders(clip, info, media)],
      ['rendition', renditionContenders(clip, info, media)],
    ];
    const medians: Record<string, Record<string, number>> = {};
    const ranges: Record<string, Record<string, string>> = {};
    const quirks: Record<string, string[]> = {};
    for (const [step, contenders] of steps) {
      argvQuirks.clear();
      ({ medians: medians[step], ranges: ranges[step] } = await measure(`${variant} ${step}`, contenders, repeats, join(dir, `${variant}-${step}`)));
      quirks[step] = [...argvQuirks];
    }
    perVariant[variant] = medians;
    results.push(...describe(variant, plan.action, { medians, ranges, quirks }, repeats));
  }

  if (cold) {
    const warm = perVariant.h264!.poster!.module!;
    results.push({
      name: 'first module call in a process (poster, h264)',
      value: moduleFirst.ms,
      unit: 'ms',
      baseline: warm,
      ratio: ratioOf(moduleFirst.ms, warm),
      note: `vs the warm median; fluent-ffmpeg runs ffmpeg -formats and -encoders once per process first (first bare ffmpeg run: ${formatNumber(directFirst.ms)} ms)`,
    });
  }
  return results;
}

interface MediaSettings {
  ffmpeg: string;
  ffprobe: string;
  stripFrames: number;
  maxHeight: number;
}

/** Times every contender `repeats` times, rotating the order each repeat: medians and min–max in ms. */
async function measure(
  label: string,
  contenders: Contender[],
  repeats: number,
  out: string,
): Promise<{ medians: Record<string, number>; ranges: Record<string, string> }> {
  const times: Record<string, number[]> = Object.fromEntries(contenders.map((c) => [c.label, []]));
  for (let i = 0; i < repeats; i++) {
    const order = contenders.map((_, k) => contenders[(k + i) % contenders.length]!);
    for (const c of order) {
      const { ms } = await timed(() => c.run(`${out}-${c.label}`));
      times[c.label]!.push(ms);
    }
  }
  const medians = Object.fromEntries(Object.entries(times).map(([k, v]) => [k, median(v)]));
  const ranges = Object.fromEntries(Object.entries(times).map(([k, v]) => [k, `${formatNumber(Math.min(...v))}–${formatNumber(Math.max(...v))}`]));
  progress(`${label}: ${Object.entries(medians).map(([k, v]) => `${k} ${formatNumber(v)} ms (${ranges[k]})`).join(', ')}`);
  return { medians, ranges };
}

async function ffmpeg(bin: string, args: string[]): Promise<void> {
  await exec(bin, args, { maxBuffer: 64 * 1024 * 1024 });
}

// Plain recipes: only -nostdin -hide_banner -loglevel error -y added, which change no work.
const QUIET = ['-nostdin', '-hide_banner', '-loglevel', 'error', '-y'];

/** Differences between the module's argv and toArgs() that change no work, seen during the run. */
const argvQuirks = new Set<string>();

/**
 * Runs a module step and checks that the ffmpeg command lines it started are the `expected` ones,
 * so "module" and "same" really do the same work. fluent-ffmpeg adds its own `-y` after the inputs
 * when the output is `-` (its file test misses `file:` URLs); a duplicate -y changes nothing, so it
 * is tolerated and reported.
 */
async function moduleRun(step: (onStart: (pid: number, line: string) => void) => Promise<unknown>, expected: FfmpegCommand[]): Promise<void> {
  const lines: string[] = [];
  await step((_pid, line) => lines.push(line));
  const want = expected.map((c) => `ffmpeg ${toArgs(c).join(' ')}`);
  const same = (ran: string, wanted: string) => {
    if (ran === wanted) return true;
    const firstY = (text: string) => text.replace(/ -y(?= )/g, (match, offset: number) => (offset === text.indexOf(' -y ') ? match : ''));
    if (firstY(ran) !== firstY(wanted)) return false;
    argvQuirks.add('argv identical but for a second -y fluent-ffmpeg adds before the null output');
    return true;
  };
  if (lines.length !== want.length || lines.some((line, i) => !same(line, want[i]!))) {
    throw new Error(`the module ran other commands than the builders give:\n  ran:      ${lines.join('\n            ')}\n  expected: ${want.join('\n            ')}`);
  }
}

function probeContenders(clip: string, m: MediaSettings): Contender[] {
  return [
    { label: 'module', run: () => probeMedia(clip) },
    { label: 'same', run: () => exec(m.ffprobe, probeArgs(clip), { maxBuffer: 64 * 1024 * 1024 }) },
  ];
}

function posterContenders(clip: string, info: ProbeResult, m: MediaSettings): Contender[] {
  const atSeconds = choosePosterSeconds(info.durationMs / 1000);
  const build = (output: string) => posterCommand({ input: clip, inputFormat: info.formatName, output, atSeconds, maxWidth: 1280, strict: true });
  return [
    { label: 'module', run: (out) => moduleRun((onStart) => makePoster(clip, `${out}.jpg`, { info, onStart }), [build(`${out}.jpg`)]) },
    { label: 'same', run: (out) => ffmpeg(m.ffmpeg, toArgs(build(`${out}.jpg`))) },
    { label: 'textbook', run: (out) => ffmpeg(m.ffmpeg, [...QUIET, '-ss', formatSeconds(atSeconds), '-i', clip, '-frames:v', '1', `${out}.jpg`]) },
  ];
}

function stripContenders(clip: string, info: ProbeResult, m: MediaSettings): Contender[] {
  const duration = info.durationMs / 1000;
  const build = (output: string) =>
    stripCommand({
      input: clip,
      inputFormat: info.formatName,
      output,
      durationSeconds: duration,
      frames: m.stripFrames,
      tileWidth: 160,
      display: { width: info.displayWidth, height: info.displayHeight },
      strict: true,
    }).command;
  const n = m.stripFrames;
  return [
    { label: 'module', run: (out) => moduleRun((onStart) => makeStrip(clip, `${out}.jpg`, { info, frames: n, onStart }), [build(`${out}.jpg`)]) },
    { label: 'same', run: (out) => ffmpeg(m.ffmpeg, toArgs(build(`${out}.jpg`))) },
    { label: 'textbook', run: (out) => ffmpeg(m.ffmpeg, [...QUIET, '-i', clip, '-vf', `fps=${n}/${formatSeconds(duration)},scale=160:-2,tile=${n}x1`, '-frames:v', '1', `${out}.jpg`]) },
  ];
}

function renditionContenders(clip: string, info: ProbeResult, m: MediaSettings): Contender[] {
  const plan = renditionPlan(info, { maxHeight: m.maxHeight });
  const durationSeconds = info.durationMs / 1000;
  const check = decodeCheckCommand({ input: clip, inputFormat: info.formatName, durationSeconds });
  const build = (output: string) => renditionCommand({ input: clip, inputFormat: info.formatName, output, plan, maxHeight: m.maxHeight, durationSeconds, strict: true });
  const expected = (output: string) => (plan.action === 'skip' ? [check] : plan.action === 'remux' ? [check, build(output)] : [build(output)]);
  const contenders: Contender[] = [
    { label: 'module', run: (out) => moduleRun((onStart) => makeRendition(clip, `${out}.mp4`, { info, maxHeight: m.maxHeight, onStart }), expected(`${out}.mp4`)) },
    {
      label: 'same',
      run: async (out) => {
        for (const command of expected(`${out}.mp4`)) await ffmpeg(m.ffmpeg, toArgs(command));
      },
    },
    {
      label: 'textbook',
      run: (out) =>
        ffmpeg(m.ffmpeg, [...QUIET, '-i', clip, '-c:v', 'libx264', '-preset', 'veryfast', '-crf', '23', '-pix_fmt', 'yuv420p', '-c:a', 'aac', '-movflags', '+faststart', `${out}.mp4`]),
    },
  ];
  if (plan.action === 'remux') contenders.push({ label: 'remux only', run: (out) => ffmpeg(m.ffmpeg, toArgs(build(`${out}.mp4`))) });
  return contenders;
}

const GOALS: Record<Exclude<Step, 'probe'>, string> = { poster: '<= 1.2', strip: '<= 1.2', rendition: '<= 1.1' };

interface StepFigures {
  medians: Record<string, Record<string, number>>;
  ranges: Record<string, Record<string, string>>;
  quirks: Record<string, string[]>;
}

function describe(variant: string, action: string, figures: StepFigures, repeats: number): BenchResult[] {
  const { medians, ranges } = figures;
  const results: BenchResult[] = [];
  const line = (name: string, value: number, baseline: number, goal: string | undefined, note: string): BenchResult => ({
    name,
    value,
    unit: 'ms',
    baseline,
    ratio: ratioOf(value, baseline),
    ...(goal ? { goal } : {}),
    note,
  });
  const probe = medians.probe!;
  results.push(line(`${variant} probeMedia vs ffprobe`, probe.module!, probe.same!, undefined, `medians of ${repeats} (module ${ranges.probe!.module}, ffprobe ${ranges.probe!.same} ms); the module also reads the MP4 box order`));
  for (const step of ['poster', 'strip', 'rendition'] as const) {
    const m = medians[step]!;
    const what = step === 'rendition' ? `rendition (${action})` : step;
    const same =
      step === 'rendition' && action === 'remux'
        ? 'same commands: full decode check + remux'
        : step === 'rendition' && action === 'skip'
          ? 'same command: full decode check'
          : 'same ffmpeg arguments, run by execFile';
    const r = ranges[step]!;
    const quirks = figures.quirks[step]!.length ? `; ${figures.quirks[step]!.join('; ')}` : '';
    results.push(line(`${variant} ${what}: module vs same args`, m.module!, m.same!, GOALS[step], `${same}; medians of ${repeats} (module ${r.module}, same ${r.same} ms)${quirks}`));
    const textbookNote =
      step === 'rendition' && action !== 'transcode'
        ? 'STACK.md transcode recipe; the module remuxes this clip instead'
        : step === 'rendition'
          ? 'STACK.md libx264 veryfast crf 23 yuv420p aac +faststart (module adds the ≤720p scale, drops data/metadata)'
          : step === 'poster'
            ? 'STACK.md -ss T -i in -frames:v 1 (module adds guards, even-width scale, -q:v 3, -xerror)'
            : 'STACK.md fps=…,scale=160:-2,tile=Nx1 (module adds guards, -q:v 5, -xerror)';
    results.push(line(`${variant} ${what}: module vs textbook`, m.module!, m.textbook!, GOALS[step], `${textbookNote}; textbook ${r.textbook} ms`));
    if (m['remux only'] !== undefined) {
      results.push(
        line(
          `${variant} rendition (remux): module vs remux alone`,
          m.module!,
          m['remux only']!,
          GOALS.rendition,
          `the difference is makeRendition's full decode check before a remux (about ${formatNumber(m.same! - m['remux only']!)} ms here); remux ${r['remux only']} ms`,
        ),
      );
    }
  }
  const total = (key: string) => probe[key === 'textbook' ? 'same' : key]! + medians.poster![key]! + medians.strip![key]! + medians.rendition![key]!;
  results.push(
    line(`${variant} worker steps per clip: module vs same args`, total('module'), total('same'), undefined, 'probe + poster + strip + rendition, sum of medians'),
    line(`${variant} worker steps per clip: module vs textbook`, total('module'), total('textbook'), undefined, 'textbook side: bare ffprobe + the three STACK.md recipes'),
  );
  return results;
}

if (require.main === module) runCli('worker-media', run);
