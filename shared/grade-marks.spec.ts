import { componentLabel, componentOrder, markWords } from './grade-marks';

describe('componentLabel', () => {
  test('our names for the fixed parts, the team\'s name for an extra part, the key when it has none', () => {
    const extra = new Map([['finish', 'Finish']]);
    expect(['assignment', 'footwork', 'hands', 'padLevel', 'effort', 'finish', 'eyes'].map((k) => componentLabel(k, extra))).toEqual([
      'Assignment',
      'Footwork',
      'Hands',
      'Pad level',
      'Effort',
      'Finish',
      'eyes',
    ]);
  });
});

describe('componentOrder', () => {
  test('assignment and technique first, extra parts in their order, effort last', () => {
    expect(componentOrder(['effort', 'finish', 'hands', 'assignment', 'eyes', 'padLevel', 'footwork'])).toEqual(['assignment', 'footwork', 'hands', 'padLevel', 'finish', 'eyes', 'effort']);
    expect(componentOrder(['effort'])).toEqual(['effort']);
  });
});

describe('markWords', () => {
  test('every mark carries a word and a symbol; bad marks never share a symbol with good ones', () => {
    const good = (['plus', 'right'] as const).map(markWords);
    const bad = (['minus', 'missed', 'loaf'] as const).map(markWords);
    expect(good.map((m) => m.word)).toEqual(['plus', 'right']);
    expect(bad.map((m) => m.word)).toEqual(['minus', 'missed', 'loaf']);
    expect(good.every((m) => m.good === true)).toBe(true);
    expect(bad.every((m) => m.good === false)).toBe(true);
    for (const g of good) for (const b of bad) expect(g.symbol).not.toBe(b.symbol);
    expect(markWords(null)).toMatchObject({ word: 'not graded', good: null });
  });
});
