import { NO_SELECTION, pickSnap, stepSelection } from './snap-selection';

const ORDER = [11, 12, 13, 14, 15];

describe('snap selection', () => {
  it('selects one snap, then a range with shift from the anchor', () => {
    const one = pickSnap(ORDER, NO_SELECTION, 12, 'only');
    expect(one).toEqual({ anchorId: 12, focusId: 12, ids: [12] });
    expect(pickSnap(ORDER, one, 14, 'range')).toEqual({ anchorId: 12, focusId: 14, ids: [12, 13, 14] });
    expect(pickSnap(ORDER, one, 11, 'range').ids).toEqual([11, 12]);
  });

  it('toggles single snaps in and out, never to an empty selection', () => {
    const two = pickSnap(ORDER, pickSnap(ORDER, NO_SELECTION, 15, 'only'), 11, 'toggle');
    expect(two.ids).toEqual([11, 15]);
    const back = pickSnap(ORDER, two, 11, 'toggle');
    expect(back.ids).toEqual([15]);
    expect(pickSnap(ORDER, back, 15, 'toggle').ids).toEqual([15]);
  });

  it('steps with J/K and grows the range with shift, stopping at the ends', () => {
    let selection = stepSelection(ORDER, NO_SELECTION, 1, false);
    expect(selection.ids).toEqual([11]);
    selection = stepSelection(ORDER, selection, 1, true);
    selection = stepSelection(ORDER, selection, 1, true);
    expect(selection).toEqual({ anchorId: 11, focusId: 13, ids: [11, 12, 13] });
    selection = stepSelection(ORDER, selection, -1, false);
    expect(selection.ids).toEqual([12]);
    expect(stepSelection(ORDER, pickSnap(ORDER, selection, 15, 'only'), 1, false).ids).toEqual([15]);
  });
});
