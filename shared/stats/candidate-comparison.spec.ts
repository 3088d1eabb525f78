import fc from 'fast-check';
import { probabilityRateHigher } from './beta-compare';
import { compareCandidates, formatProbability, MIN_SNAPS_TO_COMPARE } from './candidate-comparison';
import { twoProportionZTest } from './two-proportion';

describe('compareCandidates', () => {
  test('the brief\'s reading, word for word', () => {
    const { pairs } = compareCandidates([{ name: 'A', plus: 149, minus: 91 }, { name: 'B', plus: 99, minus: 81 }]);
    expect(pairs).toHaveLength(1);
    expect(pairs[0].reading).toBe("A graded plus on 62 % of 240 snaps, B on 55 % of 180; probability A's true rate is higher: 0.93");
    expect(pairs[0].warning).toBeNull();
    expect(pairs[0].probabilityAHigher).toBe(probabilityRateHigher(149, 91, 99, 81));
    const test = twoProportionZTest(149, 240, 99, 180)!;
    expect(pairs[0]).toMatchObject({ difference: test.difference, z: test.z, pValue: test.pValue });
  });

  test('four candidates → six pairs in order, with each candidate\'s rate and interval', () => {
    const result = compareCandidates([
      { name: 'Okafor', plus: 80, minus: 40 },
      { name: 'Lindqvist', plus: 70, minus: 50 },
      { name: 'Brandt', plus: 20, minus: 5 },
      { name: 'Castellano', plus: 0, minus: 0 },
    ]);
    expect(result.pairs.map((p) => `${p.a}-${p.b}`)).toEqual([
      'Okafor-Lindqvist', 'Okafor-Brandt', 'Okafor-Castellano', 'Lindqvist-Brandt', 'Lindqvist-Castellano', 'Brandt-Castellano',
    ]);
    expect(result.candidates[2]).toMatchObject({ name: 'Brandt', snaps: 25, rate: 0.8 });
    expect(result.candidates[3]).toMatchObject({ rate: null, interval: null });
  });

  test(`fewer than ${MIN_SNAPS_TO_COMPARE} snaps on either side → "too few snaps to tell"`, () => {
    const [pair] = compareCandidates([{ name: 'A', plus: 20, minus: 9 }, { name: 'B', plus: 100, minus: 80 }]).pairs;
    expect(pair.warning).toBe('too few snaps to tell');
    const [enough] = compareCandidates([{ name: 'A', plus: 20, minus: 10 }, { name: 'B', plus: 15, minus: 15 }]).pairs;
    expect(enough.warning).toBeNull();
  });

  test('a candidate without graded snaps is named as such; no test is run', () => {
    const [pair] = compareCandidates([{ name: 'A', plus: 0, minus: 0 }, { name: 'B', plus: 40, minus: 20 }]).pairs;
    expect(pair).toMatchObject({ difference: null, z: null, pValue: null, warning: 'too few snaps to tell' });
    // A's posterior is uniform, so P(A > B) = E[1 − X_B] = 21/62 = 0.339 for B ~ Beta(41, 21).
    expect(pair.probabilityAHigher).toBeCloseTo(21 / 62, 12);
    expect(pair.reading).toBe("A has no graded snaps, B graded plus on 67 % of 60 snaps; probability A's true rate is higher: 0.34");
  });

  test('wrong number of candidates or bad counts throw', () => {
    expect(() => compareCandidates([{ name: 'A', plus: 1, minus: 1 }])).toThrow(RangeError);
    expect(() => compareCandidates(Array.from({ length: 5 }, (_, i) => ({ name: `P${i}`, plus: 1, minus: 1 })))).toThrow(RangeError);
    expect(() => compareCandidates([{ name: 'A', plus: -1, minus: 1 }, { name: 'B', plus: 1, minus: 1 }])).toThrow(RangeError);
  });

  test('property: pairs (A, B) and (B, A) mirror each other', () => {
    const side = fc.tuple(fc.integer({ min: 0, max: 500 }), fc.integer({ min: 0, max: 500 }));
    fc.assert(
      fc.property(side, side, ([pA, mA], [pB, mB]) => {
        const [ab] = compareCandidates([{ name: 'A', plus: pA, minus: mA }, { name: 'B', plus: pB, minus: mB }]).pairs;
        const [ba] = compareCandidates([{ name: 'B', plus: pB, minus: mB }, { name: 'A', plus: pA, minus: mA }]).pairs;
        const zMirror = ab.z === null ? ba.z === null : Math.abs(ab.z + ba.z!) < 1e-12;
        return zMirror && Math.abs(ab.probabilityAHigher + ba.probabilityAHigher - 1) < 1e-9 && ab.warning === ba.warning;
      }),
    );
  });
});

describe('formatProbability', () => {
  test('two decimals, never a false certainty', () => {
    expect(formatProbability(0.9277)).toBe('0.93');
    expect(formatProbability(0.995)).toBe('0.99');
    expect(formatProbability(0.9996)).toBe('above 0.99');
    expect(formatProbability(0.004)).toBe('below 0.01');
    expect(formatProbability(0.5)).toBe('0.50');
  });
});
