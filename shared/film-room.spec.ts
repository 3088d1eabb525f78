import fc from 'fast-check';
import { inPositionGroup, mergeWatched } from './film-room';

describe('mergeWatched', () => {
  test('overlapping and touching ranges merge; a replay does not count twice', () => {
    // Worked by hand: [0,1000] ∪ [500,2000] ∪ [2000,2500] = [0,2500]; [4000,5000] apart. Covered 2500 + 1000.
    expect(mergeWatched([[500, 2000], [0, 1000], [2000, 2500], [4000, 5000], [4200, 4300]], 10_000)).toEqual({ ranges: [[0, 2500], [4000, 5000]], coveredMs: 3500 });
  });
  test('clipped to the clip; reversed ranges are turned round; empty ones dropped', () => {
    expect(mergeWatched([[9000, 12_000], [300, 100], [50, 50]], 10_000)).toEqual({ ranges: [[100, 300], [9000, 10_000]], coveredMs: 1200 });
  });
  test('covered time never exceeds the clip nor the sum of the parts, and merging again changes nothing', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: -500, max: 12_000 }), fc.integer({ min: -500, max: 12_000 }))), (ranges) => {
        const once = mergeWatched(ranges as [number, number][], 10_000);
        expect(once.coveredMs).toBeLessThanOrEqual(10_000);
        expect(once.coveredMs).toBeLessThanOrEqual(ranges.reduce((s, [a, b]) => s + Math.abs(b - a), 0));
        expect(mergeWatched(once.ranges, 10_000)).toEqual(once);
      }),
    );
  });
});

describe('inPositionGroup', () => {
  test('OL holds the five interior spots; TE only tight ends; a swing player belongs to each spot he lists', () => {
    expect(inPositionGroup('OL', ['RG', 'LG'])).toBe(true);
    expect(inPositionGroup('OL', ['TE'])).toBe(false);
    expect(inPositionGroup('TE', ['TE', 'RT'])).toBe(true);
    expect(inPositionGroup('LG', ['RG', 'LG'])).toBe(true);
    expect(inPositionGroup('C', ['RG'])).toBe(false);
  });
});
