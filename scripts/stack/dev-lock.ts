import { readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';

export type DevLockClaim =
  | { readonly claimed: true }
  | { readonly claimed: false; readonly pid: number; readonly url: string; readonly mailboxUrl: string };

interface RecordedChild {
  readonly name: string;
  readonly pid: number;
  /** Text its command line contains, so a reused pid is never killed by mistake. */
  readonly marker: string;
}

const STACK_MARKER = 'scripts/stack.ts dev';

/**
 * One dev stack per checkout. The pid file (.data/dev/stack.pid) is created atomically; line 1 is
 * the orchestrator's pid, line 2 the app URL, line 3 the mailbox URL (scripts/lib.sh reads them),
 * then one "child <pid> <name> <marker>" line per long-running child so that a stack killed with
 * SIGKILL can be cleaned up by the next start.
 */
export class DevLock {
  private header = '';
  private children: RecordedChild[] = [];

  constructor(private readonly file: string) {}

  claim(info: { url: string; mailboxUrl: string | undefined }): DevLockClaim {
    this.header = `${process.pid}\n${info.url}\n${info.mailboxUrl ?? ''}\n`;
    for (let attempt = 0; attempt < 3; attempt++) {
      try {
        writeFileSync(this.file, this.header, { flag: 'wx' });
        return { claimed: true };
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
      }
      const current = this.read();
      if (current && current.pid !== process.pid && commandLineOf(current.pid).includes(STACK_MARKER)) {
        return { claimed: false, pid: current.pid, url: current.url, mailboxUrl: current.mailboxUrl };
      }
      // Stale: its stack was killed. Stop what it left behind, then take over.
      if (current) stopLeftovers(current.children);
      const aside = `${this.file}.stale-${process.pid}`;
      try {
        renameSync(this.file, aside);
        rmSync(aside, { force: true });
      } catch {
        // Another starter moved it first; try again.
      }
    }
    throw new Error(`could not claim ${this.file}; remove it if no stack is running`);
  }

  recordChild(name: string, pid: number | undefined, marker: string): void {
    if (pid === undefined) return;
    this.children.push({ name, pid, marker });
    const lines = this.children.map((c) => `child ${c.pid} ${c.name} ${c.marker}`);
    writeFileSync(this.file, `${this.header}${lines.join('\n')}\n`);
  }

  release(): void {
    const current = this.read();
    if (current?.pid === process.pid) rmSync(this.file, { force: true });
  }

  private read(): { pid: number; url: string; mailboxUrl: string; children: RecordedChild[] } | undefined {
    let text: string;
    try {
      text = readFileSync(this.file, 'utf8');
    } catch {
      return undefined;
    }
    const [pidLine = '', url = '', mailboxUrl = '', ...rest] = text.split('\n');
    const children = rest.flatMap((line) => {
      const match = /^child (\d+) (\S+) (.+)$/.exec(line);
      return match ? [{ pid: Number(match[1]), name: match[2], marker: match[3] }] : [];
    });
    return { pid: Number(pidLine), url, mailboxUrl, children };
  }
}

export function commandLineOf(pid: number): string {
  if (!Number.isInteger(pid) || pid <= 0) return '';
  try {
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').join(' ');
  } catch {
    return '';
  }
}

function stopLeftovers(children: readonly RecordedChild[]): void {
  const alive = children.filter((c) => commandLineOf(c.pid).includes(c.marker));
  if (!alive.length) return;
  process.stderr.write(`[stack] stopping what a killed stack left running: ${alive.map((c) => `${c.name} (${c.pid})`).join(', ')}\n`);
  // Children were started in their own process groups (pgid = pid).
  const signalAll = (signal: NodeJS.Signals) => {
    for (const child of alive) {
      try {
        process.kill(-child.pid, signal);
      } catch {
        // Gone.
      }
    }
  };
  signalAll('SIGTERM');
  const deadline = Date.now() + 5000;
  while (Date.now() < deadline && alive.some((c) => commandLineOf(c.pid).includes(c.marker))) {
    Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 100);
  }
  signalAll('SIGKILL');
}
