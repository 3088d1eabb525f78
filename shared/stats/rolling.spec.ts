import fc from 'fast-check';
import { rollingAverage, rollingPlusRate } from './rolling';

describe('rollingAverage', () => {
  test('mean of the last N values, null until a full window', () => {
    expect(rollingAverage([0.5, 0.7, 0.6, 0.9, 0.8], 3)).toEqual([null, null, (0.5 + 0.7 + 0.6) / 3, (0.7 + 0.6 + 0.9) / 3, (0.6 + 0.9 + 0.8) / 3]);
    expect(rollingAverage([0.5, 0.7], 1)).toEqual([0.5, 0.7]);
    expect(rollingAverage([0.5, 0.7], 3)).toEqual([null, null]);
    expect(rollingAverage([], 3)).toEqual([]);
  });

  test('bad window throws', () => {
    expect(() => rollingAverage([1], 0)).toThrow(RangeError);
    expect(() => rollingAverage([1], 1.5)).toThrow(RangeError);
  });

  test('property: each value lies between the window\'s min and max', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 60 }), fc.integer({ min: 1, max: 8 }), (values, window) =>
        rollingAverage(values, window).every((avg, i) => {
          if (avg === null) return i + 1 < window;
          const slice = values.slice(i + 1 - window, i + 1);
          return avg >= Math.min(...slice) - 1e-12 && avg <= Math.max(...slice) + 1e-12;
        }),
      ),
    );
  });
});

describe('rollingPlusRate', () => {
  test('pools snaps of the window, so small sessions weigh less', () => {
    const sessions = [{ plus: 6, minus: 0 }, { plus: 30, minus: 30 }, { plus: 40, minus: 20 }];
    // Window 2 at the last session: (30 + 40) / 120, not the mean of 0.5 and 0.667.
    expect(rollingPlusRate(sessions, 2)).toEqual([null, 36 / 66, 70 / 120]);
  });

  test('a window with no graded snaps → null; bad counts throw', () => {
    expect(rollingPlusRate([{ plus: 0, minus: 0 }, { plus: 0, minus: 0 }], 2)).toEqual([null, null]);
    expect(() => rollingPlusRate([{ plus: -1, minus: 0 }], 1)).toThrow(RangeError);
  });
});
