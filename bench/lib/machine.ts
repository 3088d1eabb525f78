import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { availableParallelism, loadavg, totalmem } from 'node:os';

/** The machine a run was made on, printed under every table (figures mean little without it). */
export interface MachineInfo {
  cpuModel: string;
  nproc: number;
  memoryGiB: number;
  node: string;
  ffmpeg: string;
  /** 1-minute load average when the figures were printed: other work on the machine skews them. */
  load1: number;
}

export function machineInfo(): MachineInfo {
  let cpuModel = 'unknown';
  try {
    cpuModel = /^model name\s*:\s*(.+)$/m.exec(readFileSync('/proc/cpuinfo', 'utf8'))?.[1]?.trim() ?? cpuModel;
  } catch {
    // Not Linux: leave it unknown.
  }
  let ffmpeg = 'not found';
  try {
    const out = execFileSync(process.env.FFMPEG_PATH || '/usr/bin/ffmpeg', ['-hide_banner', '-version'], { encoding: 'utf8' });
    ffmpeg = /ffmpeg version (\S+)/.exec(out)?.[1] ?? 'unknown';
  } catch {
    // Reported as not found.
  }
  return { cpuModel, nproc: availableParallelism(), memoryGiB: Math.round(totalmem() / 1024 ** 3), node: process.version, ffmpeg, load1: loadavg()[0]! };
}

export function describeMachine(info: MachineInfo = machineInfo()): string {
  return `${info.nproc} × ${info.cpuModel}, ${info.memoryGiB} GiB RAM, Node ${info.node}, ffmpeg ${info.ffmpeg}, load ${info.load1.toFixed(2)}`;
}
