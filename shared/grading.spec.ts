import { plusRate, snapResult, tally, type GradeMarks } from './grading';

// The strict rule is how most line rooms grade: a lineman "wins" the snap when he did his job
// (assignment right) and no part of his technique lost it (common practice, no source).
const marks = (over: Partial<GradeMarks> = {}): GradeMarks => ({
  assignment: 'right',
  footwork: 'plus',
  hands: 'plus',
  padLevel: 'plus',
  effort: 'plus',
  extra: {},
  ...over,
});

describe('snapResult, strict rule', () => {
  test('assignment right and no technique minus → plus, even with components not graded', () => {
    expect(snapResult(marks())).toBe('plus');
    expect(snapResult(marks({ footwork: null, hands: null, padLevel: null, effort: null }))).toBe('plus');
  });
  test('any technique minus → minus', () => {
    expect(snapResult(marks({ hands: 'minus' }))).toBe('minus');
    expect(snapResult(marks({ extra: { finish: 'minus' } }))).toBe('minus');
  });
  test('a missed assignment is minus whatever the technique', () => {
    expect(snapResult(marks({ assignment: 'missed' }))).toBe('minus');
  });
  test('a loaf is never plus', () => {
    expect(snapResult(marks({ effort: 'loaf' }))).toBe('minus');
  });
  test('effort minus alone does not lose the snap under the strict rule (it is not technique)', () => {
    expect(snapResult(marks({ effort: 'minus' }))).toBe('plus');
  });
  test('no assignment mark yet → no result', () => {
    expect(snapResult(marks({ assignment: null }))).toBeNull();
  });
});

describe('snapResult, points rule', () => {
  // Worked example: weights assignment 2, footwork 1, hands 1, padLevel 1, effort 1; pass at 4.
  // right (+2), footwork + (+1), hands − (−1), pad + (+1), effort + (+1) = 4 → plus.
  // Same with pad level − instead: 2 + 1 − 1 − 1 + 1 = 2 → minus.
  // Missed (−3 penalty) with everything else plus: −3 + 1 + 1 + 1 + 1 = 1 → minus.
  const rule = { kind: 'points' as const, weights: { assignment: 2, footwork: 1, hands: 1, padLevel: 1, effort: 1 }, missedPenalty: 3, passPoints: 4 };
  test('the worked examples', () => {
    expect(snapResult(marks({ hands: 'minus' }), rule)).toBe('plus');
    expect(snapResult(marks({ hands: 'minus', padLevel: 'minus' }), rule)).toBe('minus');
    expect(snapResult(marks({ assignment: 'missed' }), rule)).toBe('minus');
  });
  test('a loaf counts as an effort minus', () => {
    // 2 + 1 + 1 + 1 − 1 = 4 → plus; with the pass line at 5 it is minus.
    expect(snapResult(marks({ effort: 'loaf' }), rule)).toBe('plus');
    expect(snapResult(marks({ effort: 'loaf' }), { ...rule, passPoints: 5 })).toBe('minus');
  });
});

describe('plusRate and tally', () => {
  test('rate = plus ÷ (plus + minus); not graded counts in neither', () => {
    expect(plusRate(3, 1)).toBe(0.75);
    expect(plusRate(0, 0)).toBeNull();
    expect(tally(['plus', null, 'minus', 'plus', null])).toEqual({ plus: 2, minus: 1, rate: 2 / 3 });
  });
  test('effort: a loaf counts as minus when asked', () => {
    expect(tally(['plus', 'loaf', 'minus'], 'plus', ['minus', 'loaf'])).toEqual({ plus: 1, minus: 2, rate: 1 / 3 });
  });
});
