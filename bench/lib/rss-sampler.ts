import { readFileSync } from 'node:fs';

/** Resident set size of a process in bytes, from /proc/<pid>/status (VmRSS); undefined once it is gone. */
export function readRss(pid: number): number | undefined {
  try {
    const kb = /^VmRSS:\s+(\d+)\s+kB/m.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1];
    return kb === undefined ? undefined : Number(kb) * 1024;
  } catch {
    return undefined;
  }
}

/** Samples a process's RSS every intervalMs until stop(); reports the first sample and the peak. */
export class RssSampler {
  private readonly timer: NodeJS.Timeout;
  private samples: number[] = [];

  constructor(
    private readonly pid: number,
    intervalMs = 100,
  ) {
    this.sample();
    this.timer = setInterval(() => this.sample(), intervalMs);
  }

  stop(): { before: number; max: number; samples: number } {
    clearInterval(this.timer);
    this.sample();
    if (this.samples.length === 0) throw new Error(`could not read the RSS of process ${this.pid}`);
    return { before: this.samples[0]!, max: Math.max(...this.samples), samples: this.samples.length };
  }

  private sample(): void {
    const rss = readRss(this.pid);
    if (rss !== undefined) this.samples.push(rss);
  }
}
