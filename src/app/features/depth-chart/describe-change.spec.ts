import { describeChange } from './describe-change';

const NAMES = new Map([
  [11, 'Varga'],
  [12, 'Pike'],
  [16, 'Reyes'],
]);
const nameOf = (id: number) => NAMES.get(id) ?? `#${id}`;

describe('describeChange', () => {
  it('names each position whose order changed, with the order before', () => {
    const change = {
      before: [
        { position: 'LG', rank: 1, playerId: 11 },
        { position: 'LG', rank: 2, playerId: 12 },
        { position: 'TE', rank: 1, playerId: 16 },
        { position: 'C', rank: 1, playerId: 13 },
      ],
      after: [
        { position: 'LG', rank: 2, playerId: 11 },
        { position: 'LG', rank: 1, playerId: 12 },
        { position: 'LT', rank: 1, playerId: 16 },
        { position: 'C', rank: 1, playerId: 13 },
      ],
    };
    expect(describeChange(change, nameOf)).toEqual(['LT: Reyes (was nobody)', 'LG: Pike, Varga (was Varga, Pike)', 'TE: nobody (was Reyes)']);
  });

  it('reads the lists from JSON text too, and says nothing for an unchanged chart', () => {
    const same = JSON.stringify([{ position: 'C', rank: 1, playerId: 13 }]);
    expect(describeChange({ before: same, after: same }, nameOf)).toEqual([]);
    expect(describeChange({ before: 'not json', after: same }, nameOf)).toEqual(['C: #13 (was nobody)']);
  });
});
