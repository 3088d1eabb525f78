import { spawn, type ChildProcess } from 'node:child_process';
import { closeSync, openSync, readFileSync } from 'node:fs';
import { createInterface } from 'node:readline';
import { paint } from './log';

export interface ChildExit {
  readonly code: number | null;
  readonly signal: NodeJS.Signals | null;
}

export interface ChildSpec {
  readonly name: string;
  readonly command: string;
  readonly args: readonly string[];
  readonly cwd: string;
  readonly env: NodeJS.ProcessEnv;
  /** 'prefix': lines go to our stdout/stderr as "[name] …"; a path: appended to that log file;
   *  'inherit': the child owns the terminal (jest). */
  readonly output: 'prefix' | 'inherit' | { readonly file: string };
  /** Own process group (default): Ctrl-C reaches only the orchestrator, which then stops the
   *  services in order, and stopping a child also reaches whatever it spawned. */
  readonly detached?: boolean;
  /** Open an IPC channel; the child announces readiness with process.send({ type: 'ready', … })
   *  and can notice the orchestrator vanishing (the channel closes even on SIGKILL). */
  readonly ipc?: boolean;
}

const PREFIX_COLORS = [35, 34, 32, 33, 36, 95, 94];
let nextColor = 0;

/** A child process the orchestrator starts, watches and stops (SIGTERM, then SIGKILL). */
export class ManagedChild {
  readonly exited: Promise<ChildExit>;
  private readonly process: ChildProcess;
  private exitInfo: ChildExit | undefined;
  private readonly detached: boolean;

  constructor(readonly spec: ChildSpec) {
    this.detached = spec.detached ?? true;
    let logFd: number | undefined;
    const stdio: ('ignore' | 'pipe' | 'inherit' | 'ipc' | number)[] =
      spec.output === 'inherit'
        ? ['inherit', 'inherit', 'inherit']
        : spec.output === 'prefix'
          ? ['ignore', 'pipe', 'pipe']
          : ((logFd = openSync(spec.output.file, 'a')), ['ignore', logFd, logFd]);
    if (spec.ipc) stdio.push('ipc');
    this.process = spawn(spec.command, [...spec.args], { cwd: spec.cwd, env: spec.env, stdio, detached: this.detached });
    if (logFd !== undefined) closeSync(logFd);
    if (spec.output === 'prefix') this.prefixOutput();
    this.exited = new Promise((resolve) => {
      const settle = (info: ChildExit) => {
        if (this.exitInfo) return;
        this.exitInfo = info;
        // Whatever the child spawned and left behind (e.g. an ffmpeg) goes with it.
        if (this.detached) this.signalGroup('SIGKILL');
        resolve(info);
      };
      this.process.once('exit', (code, signal) => settle({ code, signal }));
      this.process.once('error', (error) => {
        process.stderr.write(`[${spec.name}] could not start ${spec.command}: ${error.message}\n`);
        settle({ code: 127, signal: null });
      });
    });
  }

  get name(): string {
    return this.spec.name;
  }

  get pid(): number | undefined {
    return this.process.pid;
  }

  get hasExited(): boolean {
    return this.exitInfo !== undefined;
  }

  /** Resolves with the first IPC message of type 'ready'; rejects if the child exits first. */
  waitForReady<T extends object>(timeoutMs: number): Promise<T> {
    return new Promise<T>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`${this.name} did not report ready within ${timeoutMs / 1000} s`)), timeoutMs);
      this.process.on('message', (message: unknown) => {
        if (message && typeof message === 'object' && (message as { type?: unknown }).type === 'ready') {
          clearTimeout(timer);
          resolve(message as T);
        }
      });
      void this.exited.then((exit) => {
        clearTimeout(timer);
        reject(new Error(`${this.name} exited before it was ready (${describeExit(exit)})`));
      });
    });
  }

  /** SIGTERM, then SIGKILL once graceMs have passed. Resolves when the process has exited. */
  async stop(graceMs: number): Promise<ChildExit> {
    if (this.exitInfo) return this.exitInfo;
    this.signal('SIGTERM');
    const timer = setTimeout(() => {
      if (graceMs > 0) process.stderr.write(`[stack] ${this.name} did not stop within ${graceMs / 1000} s of SIGTERM: killing it\n`);
      this.signal('SIGKILL');
    }, graceMs);
    const exit = await this.exited;
    clearTimeout(timer);
    return exit;
  }

  kill(): void {
    if (!this.exitInfo) this.signal('SIGKILL');
  }

  signal(signal: NodeJS.Signals): void {
    if (this.detached) this.signalGroup(signal);
    else if (!this.exitInfo) this.process.kill(signal);
  }

  /** The last lines of the child's log file, for error messages. */
  logTail(lines = 30): string {
    if (typeof this.spec.output !== 'object') return '';
    try {
      return readFileSync(this.spec.output.file, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
    } catch {
      return '';
    }
  }

  private signalGroup(signal: NodeJS.Signals): void {
    const pid = this.process.pid;
    if (pid === undefined) return;
    try {
      process.kill(-pid, signal);
    } catch {
      // The group is already gone.
    }
  }

  private prefixOutput(): void {
    const color = PREFIX_COLORS[nextColor++ % PREFIX_COLORS.length];
    const label = paint(color, `[${this.spec.name}]`);
    const pipe = (stream: NodeJS.ReadableStream | null, target: NodeJS.WriteStream) => {
      if (!stream) return;
      createInterface({ input: stream, crlfDelay: Infinity }).on('line', (line) => target.write(`${label} ${line}\n`));
    };
    pipe(this.process.stdout, process.stdout);
    pipe(this.process.stderr, process.stderr);
  }
}

export function describeExit(exit: ChildExit): string {
  return exit.signal ? `killed by ${exit.signal}` : `exit code ${exit.code}`;
}
