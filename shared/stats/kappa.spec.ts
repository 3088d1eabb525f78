import fc from 'fast-check';
import { cohensKappa, kappaByComponent } from './kappa';

/** Expands a square agreement table (rows: coach A's label, columns: coach B's) into label pairs. */
function pairsFromTable(labels: string[], table: number[][]): [string, string][] {
  const pairs: [string, string][] = [];
  table.forEach((row, i) => row.forEach((count, j) => {
    for (let k = 0; k < count; k++) pairs.push([labels[i], labels[j]]);
  }));
  return pairs;
}

describe('cohensKappa', () => {
  // Wikipedia, "Cohen's kappa", worked example (FROM MEMORY): 50 applications, both yes 20, A yes
  // B no 5, A no B yes 10, both no 15 → pₒ = 0.7, pₑ = 0.5, κ = 0.4.
  test('Wikipedia "Cohen\'s kappa" worked example 20/5/10/15 → κ = 0.4 (from memory)', () => {
    const r = cohensKappa(pairsFromTable(['yes', 'no'], [[20, 5], [10, 15]]));
    expect(r.snaps).toBe(50);
    expect(r.observed).toBeCloseTo(0.7, 15);
    expect(r.expected).toBeCloseTo(0.5, 15);
    expect(r.kappa).toBeCloseTo(0.4, 14);
  });

  // Same article, "same percentages but different numbers" (FROM MEMORY): both tables agree on 60 %
  // yet κ = 0.1304 for 45/15/25/15 and κ = 0.2593 for 25/35/5/35.
  test.each([
    [[[45, 15], [25, 15]], 0.1304],
    [[[25, 35], [5, 35]], 0.2593],
  ])('Wikipedia example with 60 %% agreement %j → κ = %f (from memory)', (table, kappa) => {
    const r = cohensKappa(pairsFromTable(['yes', 'no'], table));
    expect(r.observed).toBeCloseTo(0.6, 15);
    expect(r.kappa).toBeCloseTo(kappa, 4);
  });

  // Fleiss, Levin & Paik, Statistical Methods for Rates and Proportions (3rd ed., 2003), chapter 18:
  // two raters, 100 subjects, three diagnoses, table [[75, 1, 4], [5, 4, 1], [0, 0, 10]] → κ = 0.676
  // (FROM MEMORY, table and value; pₒ = 0.89, pₑ = 0.66).
  test('Fleiss, Levin & Paik three-category example → κ = 0.676 (from memory)', () => {
    const r = cohensKappa(pairsFromTable(['psychotic', 'neurotic', 'organic'], [[75, 1, 4], [5, 4, 1], [0, 0, 10]]));
    expect(r.observed).toBeCloseTo(0.89, 14);
    expect(r.expected).toBeCloseTo(0.66, 14);
    expect(r.kappa).toBeCloseTo(0.676, 3);
  });

  test('perfect agreement → 1; agreement exactly at chance → 0; systematic disagreement → −1', () => {
    expect(cohensKappa(pairsFromTable(['plus', 'minus'], [[30, 0], [0, 20]])).kappa).toBeCloseTo(1, 15);
    expect(cohensKappa(pairsFromTable(['plus', 'minus'], [[25, 25], [25, 25]])).kappa).toBeCloseTo(0, 15);
    expect(cohensKappa(pairsFromTable(['right', 'missed'], [[0, 10], [10, 0]])).kappa).toBeCloseTo(-1, 15);
  });

  test('pₑ = 1 (both coaches used one same label throughout) → κ null, agreement still reported', () => {
    expect(cohensKappa(pairsFromTable(['right', 'missed'], [[40, 0], [0, 0]]))).toEqual({
      snaps: 40, observed: 1, expected: 1, kappa: null, note: 'one label only',
    });
    // One coach used a single label but the other did not: pₑ < 1, κ = 0 (no agreement beyond chance).
    expect(cohensKappa(pairsFromTable(['right', 'missed'], [[30, 10], [0, 0]])).kappa).toBeCloseTo(0, 15);
  });

  test('no snaps compared → null', () => {
    expect(cohensKappa([])).toEqual({ snaps: 0, observed: null, expected: null, kappa: null, note: 'no snaps compared' });
  });

  test('property: κ ∈ [−1, 1] (or null), and symmetric in the two coaches', () => {
    const label = fc.constantFrom('plus', 'minus', 'loaf');
    fc.assert(
      fc.property(fc.array(fc.tuple(label, label), { maxLength: 300 }), (pairs) => {
        const r = cohensKappa(pairs);
        const swapped = cohensKappa(pairs.map(([a, b]) => [b, a] as [string, string]));
        const inRange = r.kappa === null || (r.kappa >= -1 - 1e-12 && r.kappa <= 1 + 1e-12);
        const symmetric = r.kappa === swapped.kappa || Math.abs(r.kappa! - swapped.kappa!) < 1e-12;
        return inRange && symmetric;
      }),
    );
  });
});

describe('kappaByComponent', () => {
  test('per component, counting only snaps both coaches graded', () => {
    const rows = [
      ...pairsFromTable(['plus', 'minus'], [[20, 5], [10, 15]]).map(([a, b]) => ({ component: 'hands', a, b })),
      { component: 'hands', a: 'plus', b: null },
      { component: 'assignment', a: 'right', b: 'right' },
      { component: 'assignment', a: 'right', b: 'right' },
      { component: 'assignment', a: null, b: 'missed' },
      { component: 'footwork', a: null, b: 'plus' },
    ];
    const result = kappaByComponent(rows);
    expect(result['hands'].snaps).toBe(50);
    expect(result['hands'].kappa).toBeCloseTo(0.4, 14);
    expect(result['assignment']).toMatchObject({ snaps: 2, kappa: null, note: 'one label only' });
    expect(result['footwork']).toMatchObject({ snaps: 0, kappa: null, note: 'no snaps compared' });
  });
});
