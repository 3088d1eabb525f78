import { parseArgs } from 'node:util';

/** What `npm run backup -- DIR [--force]` and `npm run restore -- DIR [--force]` accept. */
export interface CommandLine {
  dir: string;
  force: boolean;
}

export function parseCommandLine(argv: readonly string[], usage: string): CommandLine | 'help' {
  let parsed;
  try {
    parsed = parseArgs({
      args: [...argv],
      allowPositionals: true,
      strict: true,
      options: { force: { type: 'boolean', default: false }, help: { type: 'boolean', short: 'h', default: false } },
    });
  } catch (error) {
    throw new UsageError(`${(error as Error).message}\n${usage}`);
  }
  if (parsed.values.help) return 'help';
  if (parsed.positionals.length !== 1) throw new UsageError(`Give exactly one directory.\n${usage}`);
  return { dir: parsed.positionals[0]!, force: parsed.values.force === true };
}

/** A mistake on the command line: exit code 2, as most Unix tools do. */
export class UsageError extends Error {}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  const units = ['kB', 'MB', 'GB', 'TB'];
  let value = bytes / 1024;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit += 1;
  }
  return `${value.toFixed(value < 10 ? 2 : 1)} ${units[unit]}`;
}

export function formatSeconds(ms: number): string {
  return `${(ms / 1000).toFixed(1)} s`;
}

/**
 * Progress on stdout, one line per step. Counters over many items print at most every 10 % (and
 * every item when there are few) so a log file stays readable.
 */
export class Progress {
  private readonly started = Date.now();

  constructor(private readonly out: NodeJS.WritableStream = process.stdout) {}

  line(text: string): void {
    this.out.write(`${text}\n`);
  }

  step(index: number, total: number, text: string): void {
    this.line(`[${index}/${total}] ${text}`);
  }

  counter(label: string, total: number): (done: number, detail?: string) => void {
    let lastTenth = -1;
    return (done, detail) => {
      const tenth = total === 0 ? 10 : Math.floor((done / total) * 10);
      if (total > 20 && tenth === lastTenth && done !== total) return;
      lastTenth = tenth;
      this.line(`      ${label} ${done}/${total}${detail ? `  ${detail}` : ''}`);
    };
  }

  elapsedMs(): number {
    return Date.now() - this.started;
  }
}

/** Runs `main`; a failure prints one clear message on stderr and sets a non-zero exit code. */
export function runCommand(name: string, main: () => Promise<number>): void {
  main().then(
    (code) => {
      process.exitCode = code;
    },
    (error: unknown) => {
      const message = error instanceof Error ? error.message : String(error);
      process.stderr.write(`${name} failed: ${message}\n`);
      process.exitCode = error instanceof UsageError ? 2 : 1;
    },
  );
}

/** Runs `worker` over `items` with at most `limit` at a time; the first error stops new starts and is thrown. */
export async function forEachLimited<T>(items: readonly T[], limit: number, worker: (item: T, index: number) => Promise<void>): Promise<void> {
  let next = 0;
  let failure: unknown;
  const lanes = Array.from({ length: Math.min(limit, items.length) }, async () => {
    while (failure === undefined && next < items.length) {
      const index = next++;
      try {
        await worker(items[index]!, index);
      } catch (error) {
        failure ??= error;
      }
    }
  });
  await Promise.all(lanes);
  if (failure !== undefined) throw failure;
}
