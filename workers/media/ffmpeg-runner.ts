/**
 * The one file that starts ffmpeg and ffprobe processes, and the only importer of fluent-ffmpeg
 * (archived upstream): replacing it touches nothing else. It runs the plain-data commands built in
 * ffmpeg-commands.ts as given, with a time limit that SIGKILLs the process.
 *
 * ffprobe runs through child_process, not fluent-ffmpeg: fluent's ffprobe cannot be killed on a
 * time limit (it keeps the process to itself) and parses the legacy text output, losing the display
 * matrix. fluent's own `timeout` and `progress` are unused: the first sends SIGTERM and reports
 * before the process has gone, the second runs an extra ffprobe on the input without our guards.
 */
import { execFile } from 'node:child_process';
import { access, constants } from 'node:fs/promises';
import ffmpeg from 'fluent-ffmpeg';
import { probeArgs, toArgs, type FfmpegCommand } from './ffmpeg-commands';
import { MediaError, REASONS, mediaErrorFromStderr, type FailureContext } from './media-error';
import { normaliseProbe, type ProbeResult } from './probe-result';

let ffmpegPath = '/usr/bin/ffmpeg';
let ffprobePath = '/usr/bin/ffprobe';

export function setFfmpegPath(path: string): void {
  ffmpegPath = path;
}
export function setFfprobePath(path: string): void {
  ffprobePath = path;
}

export interface RunOptions {
  timeoutMs: number;
  /** 0…1 from ffmpeg's progress lines and the command's durationSeconds, at most once per percent. */
  onProgress?: (fraction: number) => unknown;
  /** Called once the process exists (logs, tests that check it is gone afterwards). */
  onStart?: (pid: number, commandLine: string) => void;
}

// Keep stderr bounded on long runs: progress lines replace each other; past the cap the oldest lines go.
const MAX_STDERR_CHARS = 16 * 1024 * 1024;
const PROGRESS_LINE = /^\s*(frame|size)=.*time=/;
const PROGRESS_TIME = /time=\s*(\d+):(\d{2}):(\d{2}(?:\.\d+)?)/;

/** Runs one command; resolves with its stderr (progress lines collapsed), rejects with a MediaError. */
export async function run(command: FfmpegCommand, options: RunOptions): Promise<string> {
  // fluent-ffmpeg 2.1.3 throws a TypeError from inside its spawn-error handler when the binary is
  // missing (its output rings do not exist yet), which would escape as an uncaught exception and
  // leave this promise pending. Check first so that path is never taken.
  await access(ffmpegPath, constants.X_OK).catch((error: Error) => {
    throw new MediaError('tool_missing', REASONS.tool_missing, error.message);
  });
  return new Promise((resolve, reject) => {
    const lines: string[] = [];
    let chars = 0;
    let lastWasProgress = false;
    let reported = -1;
    let timedOut = false;
    let settled = false;

    const cmd = ffmpeg({ stdoutLines: 1 }).setFfmpegPath(ffmpegPath);
    command.inputs.forEach((input, i) => {
      cmd.input(input.url);
      // Global options go first, before the first input: ffmpeg reads them anywhere, and this keeps
      // the spawned argv identical to toArgs(command) (except that fluent-ffmpeg adds a second -y when the output is "-").
      addOptions((...o) => cmd.inputOptions(...o), i === 0 ? [...command.globalOptions, ...input.options] : input.options);
    });
    cmd.output(command.output);
    addOptions((...o) => cmd.outputOptions(...o), command.outputOptions);

    const timer = setTimeout(() => {
      timedOut = true;
      cmd.kill('SIGKILL');
    }, options.timeoutMs);

    const stderr = () => lines.join('\n');
    const finish = (error: MediaError | null) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      if (error) reject(error);
      else resolve(stderr());
    };

    cmd.on('start', (commandLine: string) => {
      const pid = (cmd as unknown as { ffmpegProc?: { pid?: number } }).ffmpegProc?.pid;
      if (timedOut) cmd.kill('SIGKILL');
      if (pid !== undefined) options.onStart?.(pid, commandLine);
    });
    cmd.on('stderr', (line: string) => {
      const isProgress = PROGRESS_LINE.test(line);
      if (isProgress && lastWasProgress) lines[lines.length - 1] = line;
      else {
        lines.push(line);
        chars += line.length + 1;
        // Over the cap, forget the older half: the last lines say why a run failed.
        if (chars > MAX_STDERR_CHARS) chars -= lines.splice(0, lines.length >> 1).reduce((n, l) => n + l.length + 1, 0);
      }
      lastWasProgress = isProgress;
      if (isProgress && options.onProgress && command.durationSeconds) {
        const m = PROGRESS_TIME.exec(line);
        const fraction = m ? Math.min(1, Math.max(0, (Number(m[1]) * 3600 + Number(m[2]) * 60 + Number(m[3])) / command.durationSeconds)) : -1;
        // Whole percents only (ffmpeg reports ten times a second); a throwing or rejecting callback
        // must not take the worker down from inside a stream callback.
        if (fraction >= 0 && (Math.floor(fraction * 100) > Math.floor(reported * 100) || (fraction === 1 && reported < 1))) {
          reported = fraction;
          try {
            Promise.resolve(options.onProgress(fraction)).catch(() => undefined);
          } catch {
            // ignored: progress is advisory
          }
        }
      }
    });
    // fluent emits 'end'/'error' after the process has exited and its pipes have closed.
    cmd.on('end', () => finish(null));
    cmd.on('error', (error: Error) => {
      if (timedOut) finish(MediaError.timeout(options.timeoutMs, stderr()));
      else if (/ENOENT|Cannot find ffmpeg/.test(error.message)) finish(new MediaError('tool_missing', REASONS.tool_missing, error.message));
      else finish(mediaErrorFromStderr(stderr() || error.message));
    });
    cmd.run();
  });
}

/** fluent splits a lone "a b" option in two; passing several arguments turns that off. */
function addOptions(add: (...options: string[]) => unknown, options: string[]): void {
  if (options.length === 0) return;
  if (options.length === 1 && /\s/.test(options[0]!)) throw new RangeError(`ambiguous single option ${JSON.stringify(options[0])}`);
  add(...options);
}

export interface ProbeOptions {
  timeoutMs: number;
  /** What is known about the file, to name a failure well (see classifyFailure). */
  failureContext?: FailureContext;
}

/** Runs ffprobe with the given arguments; resolves with stdout. */
export function runProbe(args: string[], options: ProbeOptions): Promise<string> {
  return new Promise((resolve, reject) => {
    execFile(
      ffprobePath,
      args,
      { timeout: options.timeoutMs, killSignal: 'SIGKILL', maxBuffer: 256 * 1024 * 1024, encoding: 'utf8', windowsHide: true },
      (error, stdout, stderr) => {
        if (!error) return resolve(stdout);
        const e = error as NodeJS.ErrnoException & { killed?: boolean; signal?: string };
        if (e.code === 'ENOENT') return reject(new MediaError('tool_missing', REASONS.tool_missing, e.message));
        if (e.killed && e.signal === 'SIGKILL') return reject(MediaError.timeout(options.timeoutMs, stderr));
        reject(mediaErrorFromStderr(stderr || e.message, options.failureContext));
      },
    );
  });
}

/** ffprobe → ProbeResult (moovFirst stays null: ffprobe cannot tell; probeMedia reads the boxes). */
export async function probe(file: string, options: ProbeOptions): Promise<ProbeResult> {
  const stdout = await runProbe(probeArgs(file), options);
  let json: unknown;
  try {
    json = JSON.parse(stdout);
  } catch {
    throw new MediaError('failed', REASONS.failed, 'ffprobe printed no JSON');
  }
  return normaliseProbe(json);
}

/** The argv a command stands for, as a shell-free string for logs. */
export function describe(command: FfmpegCommand): string {
  return [ffmpegPath, ...toArgs(command)].join(' ');
}
