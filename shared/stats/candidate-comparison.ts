import { probabilityRateHigher } from './beta-compare';
import { assertCount } from './counts';
import { twoProportionZTest } from './two-proportion';
import { rateWithInterval, type RateWithInterval } from './wilson';

/**
 * Fewer graded snaps than this on either side → "too few snaps to tell" (our choice). At 30 snaps a
 * 50 % rate's 95 % interval is still about ±17 points, and below it the z test's normal
 * approximation gets poor for rates near 0 or 1; the numbers are shown, with the warning.
 */
export const MIN_SNAPS_TO_COMPARE = 30;
export const TOO_FEW_SNAPS = 'too few snaps to tell';

export interface Candidate {
  name: string;
  plus: number;
  minus: number;
}

export interface CandidateSummary extends RateWithInterval {
  name: string;
}

export interface PairComparison {
  a: string;
  b: string;
  /** rateA − rateB; null when either has no graded snaps. */
  difference: number | null;
  z: number | null;
  pValue: number | null;
  /** P(A's true rate > B's) under independent Beta(1, 1) priors. */
  probabilityAHigher: number;
  reading: string;
  warning: typeof TOO_FEW_SNAPS | null;
}

export interface CandidateComparison {
  candidates: CandidateSummary[];
  /** Every pair once, in the order given: (1,2), (1,3), …, (3,4). */
  pairs: PairComparison[];
}

const percent = (rate: number) => `${Math.round(rate * 100)} %`;

/** Two decimals, but never "1.00" or "0.00", which would read as certainty. */
export function formatProbability(p: number): string {
  if (p > 0.995) return 'above 0.99';
  if (p < 0.005) return 'below 0.01';
  return p.toFixed(2);
}

function describe(c: CandidateSummary, first: boolean): string {
  if (c.rate === null) return `${c.name} has no graded snaps`;
  return first ? `${c.name} graded plus on ${percent(c.rate)} of ${c.snaps} snaps` : `${c.name} on ${percent(c.rate)} of ${c.snaps}`;
}

export function comparePair(a: CandidateSummary, b: CandidateSummary): PairComparison {
  const test = twoProportionZTest(a.plus, a.snaps, b.plus, b.snaps);
  const probabilityAHigher = probabilityRateHigher(a.plus, a.minus, b.plus, b.minus);
  const reading = `${describe(a, true)}, ${describe(b, a.rate === null)}; probability ${a.name}'s true rate is higher: ${formatProbability(probabilityAHigher)}`;
  return {
    a: a.name,
    b: b.name,
    difference: test?.difference ?? null,
    z: test?.z ?? null,
    pValue: test?.pValue ?? null,
    probabilityAHigher,
    reading,
    warning: a.snaps < MIN_SNAPS_TO_COMPARE || b.snaps < MIN_SNAPS_TO_COMPARE ? TOO_FEW_SNAPS : null,
  };
}

/** Compares 2–4 candidates for a spot, each pair once. */
export function compareCandidates(candidates: readonly Candidate[]): CandidateComparison {
  if (candidates.length < 2 || candidates.length > 4) throw new RangeError(`compare 2 to 4 players (got ${candidates.length})`);
  const summaries = candidates.map((c) => {
    assertCount(c.plus, `${c.name} plus`);
    assertCount(c.minus, `${c.name} minus`);
    return { name: c.name, ...rateWithInterval(c.plus, c.minus) };
  });
  const pairs: PairComparison[] = [];
  for (let i = 0; i < summaries.length; i++) {
    for (let j = i + 1; j < summaries.length; j++) pairs.push(comparePair(summaries[i], summaries[j]));
  }
  return { candidates: summaries, pairs };
}
