import { draftFromScheme, keyFromLabel, readSchemeDraft } from './scheme-draft';
import { scheme } from './grading-test-data';

describe('scheme draft', () => {
  it('round-trips a scheme into the PUT body', () => {
    const { input, errors } = readSchemeDraft(draftFromScheme(scheme()));
    expect(errors).toEqual({});
    expect(input).toMatchObject({ winningThreshold: 0.8, resultRule: { kind: 'strict' }, designatedGraderRole: 'coordinator' });
    expect(input?.extraComponents).toEqual([
      { key: 'finish', label: 'Finish', active: true },
      { key: 'eyes', label: 'Eyes', active: false },
    ]);
  });

  it('reads a points rule and the winning line typed as a percentage', () => {
    const draft = { ...draftFromScheme(scheme()), kind: 'points' as const, winningPercent: '85', missedPenalty: '4', passPoints: '2.5' };
    const { input } = readSchemeDraft({ ...draft, weights: { ...draft.weights, hands: '2' } });
    expect(input?.winningThreshold).toBe(0.85);
    // Retired parts carry no weight.
    expect(input?.resultRule).toEqual({ kind: 'points', weights: { assignment: 1, footwork: 1, hands: 2, padLevel: 1, effort: 1, finish: 1 }, missedPenalty: 4, passPoints: 2.5 });
  });

  it('says what is wrong instead of sending it', () => {
    const { input, errors } = readSchemeDraft({ ...draftFromScheme(scheme()), winningPercent: '40', missedReasons: '  \n ' });
    expect(input).toBeNull();
    expect(errors.winningPercent).toContain('50 to 100');
    expect(errors.missedReasons).toContain('at least one');
  });

  it('makes keys from labels that the API accepts', () => {
    expect(keyFromLabel('Eyes / target', [])).toBe('eyesTarget');
    expect(keyFromLabel('Finish', ['finish'])).toBe('finish2');
    expect(keyFromLabel('2nd effort', [])).toMatch(/^[a-z][a-zA-Z0-9]{1,30}$/);
  });
});
