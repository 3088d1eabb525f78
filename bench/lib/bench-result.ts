/**
 * One figure of a benchmark. `ratio` compares `value` with `baseline` (how is said in `note` or the
 * name); `goal` is a comparison such as "<= 1.2" or ">= 0.8", applied to `ratio` when there is one,
 * otherwise to `value`. Benchmarks report; they never fail a build (see bench/README.md).
 */
export interface BenchResult {
  name: string;
  value: number;
  unit: string;
  baseline?: number;
  ratio?: number;
  goal?: string;
  note?: string;
}

export interface BenchOptions {
  /** Smaller inputs and fewer repeats, so every benchmark together stays around a minute. */
  quick: boolean;
}

export type BenchRun = (options: BenchOptions) => Promise<BenchResult[]>;

export type GoalVerdict = 'met' | 'missed' | 'no goal';

const GOAL = /^\s*(<=|>=|<|>|≤|≥)\s*(-?\d+(?:\.\d+)?)\s*$/;

/** Whether a result meets its goal. A goal that cannot be read is an error in the benchmark. */
export function verdict(result: BenchResult): GoalVerdict {
  if (result.goal === undefined) return 'no goal';
  const match = GOAL.exec(result.goal);
  if (!match) throw new Error(`${result.name}: goal "${result.goal}" is not of the form "<= 1.2"`);
  const subject = result.ratio ?? result.value;
  const limit = Number(match[2]);
  const ok = { '<=': subject <= limit, '≤': subject <= limit, '>=': subject >= limit, '≥': subject >= limit, '<': subject < limit, '>': subject > limit }[match[1] as '<='];
  return ok ? 'met' : 'missed';
}

/** value / baseline, or undefined when there is no usable baseline. */
export function ratioOf(value: number, baseline: number): number | undefined {
  return baseline > 0 && Number.isFinite(value) ? value / baseline : undefined;
}
