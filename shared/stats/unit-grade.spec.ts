import { allPlusShare, resultScores, weakestLink, weakestLinkCounts, type LinemanResult } from './unit-grade';
import { wilsonInterval } from './wilson';

const line = (...results: ('plus' | 'minus' | null)[]): LinemanResult[] =>
  results.map((result, i) => ({ playerId: ['LT', 'LG', 'C', 'RG', 'RT', 'TE'][i], result }));

describe('allPlusShare', () => {
  test('counts snaps where every lineman on the field graded plus, six-man sets included', () => {
    const snaps = [
      line('plus', 'plus', 'plus', 'plus', 'plus'),
      line('plus', 'minus', 'plus', 'plus', 'plus'),
      line('plus', 'plus', 'plus', 'plus', 'plus', 'plus'),
      line('plus', 'plus', null, 'plus', 'plus'), // C not graded yet: left out
      line('minus', 'plus', null, 'plus', 'plus'), // left out too, though it cannot be all-plus
      [],
    ];
    expect(allPlusShare(snaps)).toEqual({ allPlus: 2, counted: 3, incomplete: 3, rate: 2 / 3, interval: wilsonInterval(2, 3) });
  });

  test('nothing fully graded → rate null', () => {
    expect(allPlusShare([line(null, 'plus')])).toMatchObject({ counted: 0, rate: null, interval: null });
  });
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
