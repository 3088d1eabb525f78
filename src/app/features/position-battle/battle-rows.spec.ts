import { parsePlayerIds, splitComparison } from './battle-rows';

const row = (value: string, snaps: number, plus: number) => ({ value, snaps, plus, rate: plus / snaps, interval: null });

describe('parsePlayerIds', () => {
  it('keeps whole positive ids once each, at most four', () => {
    expect(parsePlayerIds('12,22')).toEqual([12, 22]);
    expect(parsePlayerIds('12, 12,x,0,-3,7,8,9,10')).toEqual([12, 7, 8, 9]);
    expect(parsePlayerIds(undefined)).toEqual([]);
  });
});

describe('splitComparison', () => {
  it('lines up the values of every player, most snaps first, leaving gaps where a player has none', () => {
    const rows = splitComparison([[row('Power', 40, 30), row('Inside zone', 20, 15)], [row('Inside zone', 50, 45), row('Counter', 5, 2)]]);
    expect(rows.map((r) => [r.value, r.totalSnaps])).toEqual([
      ['Inside zone', 70],
      ['Power', 40],
      ['Counter', 5],
    ]);
    expect(rows[1].cells[0]?.snaps).toBe(40);
    expect(rows[1].cells[1]).toBeUndefined();
    expect(splitComparison([[row('A', 3, 1), row('B', 2, 1)]], 1)).toHaveLength(1);
  });
});
