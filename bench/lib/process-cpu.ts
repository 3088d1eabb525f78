import { readFileSync } from 'node:fs';

// USER_HZ: the unit of utime/stime in /proc/<pid>/stat; 100 on every common Linux build.
const TICKS_PER_SECOND = 100;

/** CPU seconds (user + system) a process has used so far, from /proc/<pid>/stat; undefined once it is gone. */
export function cpuSeconds(pid: number): number | undefined {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // Fields after the command name, which is in parentheses and may itself hold spaces.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) / TICKS_PER_SECOND;
  } catch {
    return undefined;
  }
}

/** CPU seconds each of the given processes uses while fn runs. */
export async function cpuDuring<T>(pids: Record<string, number>, fn: () => Promise<T>): Promise<{ result: T; cpu: Record<string, number> }> {
  const before = Object.fromEntries(Object.entries(pids).map(([name, pid]) => [name, cpuSeconds(pid) ?? NaN]));
  const result = await fn();
  const cpu = Object.fromEntries(Object.entries(pids).map(([name, pid]) => [name, (cpuSeconds(pid) ?? NaN) - before[name]!]));
  return { result, cpu };
}
