/**
 * Cohen's kappa between two coaches who graded the same snaps: observed agreement corrected for the
 * agreement their label frequencies would give by chance, κ = (pₒ − pₑ) / (1 − pₑ).
 */
export interface KappaResult {
  /** Snaps both coaches graded (pairs compared). */
  snaps: number;
  /** pₒ, share of snaps with the same label; null when no snaps were compared. */
  observed: number | null;
  /** pₑ, chance agreement from each coach's own label shares; null when no snaps were compared. */
  expected: number | null;
  /**
   * κ in [−1, 1]; null when no snaps were compared, or when pₑ = 1 — both coaches gave every snap
   * the same single label, so chance explains all agreement and κ is 0/0 (see `note`).
   */
  kappa: number | null;
  note: 'no snaps compared' | 'one label only' | null;
}

export function cohensKappa(pairs: readonly (readonly [string, string])[]): KappaResult {
  const snaps = pairs.length;
  if (snaps === 0) return { snaps, observed: null, expected: null, kappa: null, note: 'no snaps compared' };
  const first = new Map<string, number>();
  const second = new Map<string, number>();
  let agree = 0;
  for (const [a, b] of pairs) {
    if (a === b) agree++;
    first.set(a, (first.get(a) ?? 0) + 1);
    second.set(b, (second.get(b) ?? 0) + 1);
  }
  let expectedCount = 0; // Σ nA(k)·nB(k), kept whole so pₑ = 1 is detected exactly
  for (const [label, n] of first) expectedCount += n * (second.get(label) ?? 0);
  const observed = agree / snaps;
  const expected = expectedCount / (snaps * snaps);
  if (expectedCount === snaps * snaps) return { snaps, observed, expected, kappa: null, note: 'one label only' };
  return { snaps, observed, expected, kappa: (observed - expected) / (1 - expected), note: null };
}

export interface ComponentGradePair {
  component: string;
  /** First coach's label on this snap, or null when he did not grade it. */
  a: string | null;
  b: string | null;
}

/** Kappa per component; a snap counts for a component only when both coaches labelled it. */
export function kappaByComponent(rows: readonly ComponentGradePair[]): Record<string, KappaResult> {
  const byComponent = new Map<string, [string, string][]>();
  for (const row of rows) {
    if (!byComponent.has(row.component)) byComponent.set(row.component, []);
    if (row.a !== null && row.b !== null) byComponent.get(row.component)!.push([row.a, row.b]);
  }
  const result: Record<string, KappaResult> = {};
  for (const [component, pairs] of byComponent) result[component] = cohensKappa(pairs);
  return result;
}
