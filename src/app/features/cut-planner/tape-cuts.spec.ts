import { MIN_SEGMENT_MS, addCut, moveCut, removeCut, shortCutIndexes, sortCuts } from './tape-cuts';

describe('tape cuts', () => {
  it('sorts, rounds and de-duplicates cuts', () => {
    expect(sortCuts([9000, 4000.4, 4000, 1200.6])).toEqual([1201, 4000, 9000]);
  });

  it('adds a cut in order and refuses one that leaves less than half a second', () => {
    expect(addCut([4000, 9000], 6500, 20000)).toEqual({ cuts: [4000, 6500, 9000], index: 1 });
    expect(addCut([4000], 4000 + MIN_SEGMENT_MS - 1, 20000)).toEqual({ error: expect.stringContaining('0:04.0') });
    expect(addCut([], 300, 20000)).toEqual({ error: expect.stringContaining('half a second') });
    expect(addCut([], 19_800, 20000)).toEqual({ error: expect.stringContaining('half a second') });
  });

  it('moves a cut but keeps it between its neighbours', () => {
    expect(moveCut([4000, 9000], 0, 6000, 20000)).toEqual({ cuts: [6000, 9000], index: 0 });
    expect(moveCut([4000, 9000], 0, 12000, 20000)).toEqual({ cuts: [8500, 9000], index: 0 });
    expect(moveCut([4000, 9000], 1, 30000, 20000)).toEqual({ cuts: [4000, 19500], index: 1 });
  });

  it('removes a cut and finds cuts that make too short a snap', () => {
    expect(removeCut([1, 2, 3], 1)).toEqual([1, 3]);
    expect([...shortCutIndexes([4000, 4200, 9000], 20000)]).toEqual([0, 1]);
    expect([...shortCutIndexes([4000, 9000], 20000)]).toEqual([]);
  });
});
