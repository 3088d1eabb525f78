import { filterFrom, narrowsEnough, EMPTY_FILTER } from './cutup-filter';
import { appendClips, moveItem } from './reel-item';

describe('cut-up items', () => {
  const clip = (clipId: number) => ({ clipId, sessionTitle: 'Week 2 vs Quarry Bend', snapOrder: clipId, angle: 'sideline', posterUrl: null });

  it('adds clips at the end once each', () => {
    const first = appendClips([], [clip(1), clip(2), clip(1)]);
    expect(first.map((i) => i.clipId)).toEqual([1, 2]);
    const withNote = first.map((i) => (i.clipId === 1 ? { ...i, note: 'hat low' } : i));
    const again = appendClips(withNote, [clip(2), clip(3)]);
    expect(again.map((i) => [i.clipId, i.note])).toEqual([[1, 'hat low'], [2, ''], [3, '']]);
  });

  it('moves an item and stays inside the list', () => {
    expect(moveItem(['a', 'b', 'c'], 2, 0)).toEqual(['c', 'a', 'b']);
    expect(moveItem(['a', 'b', 'c'], 0, 9)).toEqual(['b', 'c', 'a']);
    expect(moveItem(['a', 'b'], 5, 0)).toEqual(['a', 'b']);
  });
});

describe('cut-up filter', () => {
  it('sends only what is set, and a grade part only with a player', () => {
    expect(filterFrom(EMPTY_FILTER)).toEqual({});
    expect(filterFrom({ ...EMPTY_FILTER, component: 'hands', mark: 'plus' })).toEqual({});
    expect(filterFrom({ ...EMPTY_FILTER, playerId: 70, component: 'hands', mark: 'plus', angle: 'end_zone' })).toEqual({ playerId: 70, component: 'hands', mark: 'plus', angle: 'end_zone' });
    expect(filterFrom({ ...EMPTY_FILTER, frontIds: [201] })).toEqual({ frontIds: [201] });
  });

  it('waits for something that narrows the search: an angle alone does not', () => {
    expect(narrowsEnough(filterFrom({ ...EMPTY_FILTER, angle: 'sideline' }))).toBe(false);
    expect(narrowsEnough(filterFrom({ ...EMPTY_FILTER, sessionIds: [3] }))).toBe(true);
  });
});
