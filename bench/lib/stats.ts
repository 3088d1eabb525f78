/** Small timing helpers: wall-clock milliseconds and medians. */

export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('median of no values');
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** Runs fn once and returns how long it took in milliseconds, with its result. */
export async function timed<T>(fn: () => Promise<T>): Promise<{ ms: number; result: T }> {
  const started = process.hrtime.bigint();
  const result = await fn();
  return { ms: Number(process.hrtime.bigint() - started) / 1e6, result };
}

export const MiB = 1024 * 1024;
