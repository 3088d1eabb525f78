import { linemanResults, resultScores, unitGrade, unitSnapOutcome, weakestLink, weakestLinkCounts, type LinemanResult } from './unit-grade';
import { wilsonInterval } from './wilson';

const line = (...results: ('plus' | 'minus' | null)[]): LinemanResult[] =>
  results.map((result, i) => ({ playerId: ['LT', 'LG', 'C', 'RG', 'RT', 'TE'][i], result }));

describe('unitSnapOutcome and unitGrade (from counts, as the reports have them)', () => {
  test('a snap counts once everyone on the field is graded; extra graded linemen (a sub) do not make it incomplete', () => {
    expect(unitSnapOutcome({ onField: 5, graded: 5, plus: 5 })).toBe('allPlus');
    expect(unitSnapOutcome({ onField: 5, graded: 5, plus: 4 })).toBe('notAllPlus');
    expect(unitSnapOutcome({ onField: 5, graded: 4, plus: 3 })).toBe('incomplete');
    expect(unitSnapOutcome({ onField: 5, graded: 6, plus: 6 })).toBe('allPlus');
    expect(unitSnapOutcome({ onField: 0, graded: 0, plus: 0 })).toBe('incomplete');
    expect(unitSnapOutcome({ onField: 5, graded: 0, plus: 0 })).toBe('incomplete');
  });

  test('hand-worked game of six snaps: 2 all-plus of 4 counted, 2 left out', () => {
    // Counted: snaps 1 (5/5 plus), 2 (4 of 5 plus), 3 (six-man set, 6/6 plus), 6 (5 of 5 graded, 3 plus).
    // Left out: snap 4 (4 of 5 graded), snap 5 (nobody on the field known).
    const game = [
      { onField: 5, graded: 5, plus: 5 },
      { onField: 5, graded: 5, plus: 4 },
      { onField: 6, graded: 6, plus: 6 },
      { onField: 5, graded: 4, plus: 4 },
      { onField: 0, graded: 0, plus: 0 },
      { onField: 5, graded: 5, plus: 3 },
    ];
    expect(unitGrade(game)).toEqual({ allPlus: 2, counted: 4, incomplete: 2, rate: 0.5, interval: wilsonInterval(2, 4) });
  });
});

test('linemanResults: the plus ids then the minus ids, as results', () => {
  expect(linemanResults([7, 9], [4])).toEqual([
    { playerId: '7', result: 'plus' },
    { playerId: '9', result: 'plus' },
    { playerId: '4', result: 'minus' },
  ]);
  // The weakest link of that snap is the one minus.
  expect(weakestLink(resultScores(linemanResults([7, 9], [4])))).toEqual({ playerIds: ['4'], score: 0 });
});

describe('weakestLink', () => {
  test('the one lineman who lost the snap', () => {
    expect(weakestLink(resultScores(line('plus', 'plus', 'minus', 'plus', 'plus')))).toEqual({ playerIds: ['C'], score: 0 });
  });

  test('ties are all named; points scores work too', () => {
    expect(weakestLink(resultScores(line('minus', 'plus', 'plus', 'minus', 'plus')))).toEqual({ playerIds: ['LT', 'RG'], score: 0 });
    expect(weakestLink([{ playerId: 'LT', score: 4 }, { playerId: 'LG', score: -1 }, { playerId: 'C', score: 2 }, { playerId: 'RG', score: null }])).toEqual({ playerIds: ['LG'], score: -1 });
  });

  test('nobody stands out when all graded share one score, or fewer than two are graded', () => {
    expect(weakestLink(resultScores(line('plus', 'plus', 'plus', 'plus', 'plus')))).toBeNull();
    expect(weakestLink(resultScores(line('minus', 'minus', 'minus', 'minus', 'minus')))).toBeNull();
    expect(weakestLink(resultScores(line('minus', null, null, null, null)))).toBeNull();
    expect(weakestLink([])).toBeNull();
  });

  test('weakestLinkCounts tallies who was weakest over many snaps', () => {
    const snaps = [
      line('plus', 'plus', 'minus', 'plus', 'plus'),
      line('plus', 'plus', 'minus', 'plus', 'minus'),
      line('plus', 'plus', 'plus', 'plus', 'plus'),
      line('minus', 'plus', 'plus', 'plus', null),
    ].map(resultScores);
    expect(weakestLinkCounts(snaps)).toEqual({ C: 2, RT: 1, LT: 1 });
  });
});
