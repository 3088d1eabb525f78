import { practicePriorities } from './practice-priorities';
import { readinessCell } from './readiness-test-data';
import type { Readiness, ReadinessCell } from './readiness-types';

/** Game reps only: the split does not matter to the order. */
const cell = (conceptId: number, frontId: number, plus: number, minus: number) => readinessCell(conceptId, frontId, plus, minus);

const base = (cells: ReadinessCell[]): Readiness => ({
  seasonId: 5,
  winningThreshold: 0.8,
  fewReps: 12,
  concepts: [
    { id: 1, name: 'Inside zone' },
    { id: 2, name: 'Power' },
  ],
  fronts: [
    { id: 10, name: 'Over' },
    { id: 11, name: 'Bear' },
    { id: 12, name: 'Odd' },
  ],
  cells,
});

describe('practicePriorities', () => {
  it('leaves out cells with enough reps at or above the winning grade', () => {
    expect(practicePriorities(base([cell(1, 10, 90, 10), cell(1, 11, 80, 20)]))).toEqual([]);
  });

  it('puts thin-and-low first, then surely low, then low, then thin by fewest reps', () => {
    const cells = [
      cell(1, 10, 90, 10), // fine
      cell(1, 11, 7, 3), // 10 reps, 70 %: thin and low
      cell(1, 12, 11, 0), // 11 reps, 100 %: thin only
      cell(2, 10, 30, 30), // 60 reps, 50 %: upper bound ≈ 62 % < 80 %: surely low
      cell(2, 11, 36, 14), // 50 reps, 72 %: upper bound ≈ 83 %: low, not surely
      cell(2, 12, 0, 0), // no reps: thin only
    ];
    const list = practicePriorities(base(cells));
    expect(list.map((p) => `${p.concept} × ${p.front}`)).toEqual(['Inside zone × Bear', 'Power × Over', 'Power × Bear', 'Power × Odd', 'Inside zone × Odd']);
    expect(list[0].why).toBe('only 10 reps (10 game, 0 practice); 70 % plus, under the 80 % winning grade');
    expect(list[1].why).toBe('50 % plus, under the 80 % winning grade even at the top of its 95 % interval');
    expect(list[2].why).toBe('72 % plus, under the 80 % winning grade');
    expect(list[3].why).toBe('no reps yet');
  });
});
