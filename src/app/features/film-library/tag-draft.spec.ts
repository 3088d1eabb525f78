import { BLANK_DRAFT, changedTags, draftFromSnap } from './tag-draft';
import { snap } from './film-test-data';

describe('tag draft', () => {
  it('sends only what changed, in API values', () => {
    const base = draftFromSnap(snap({ down: 2, distance: 7, notes: 'late pull' }));
    const draft = { ...base, distance: '4', resultYards: '−3', personnel: ' 12 ', notes: '' };
    expect(changedTags(draft, base)).toEqual({ update: { distance: 4, resultYards: -3, personnel: '12', notes: null }, errors: {} });
  });

  it('names fields that are not whole numbers or not two-digit personnel', () => {
    const draft = { ...BLANK_DRAFT, distance: '4.5', personnel: '7' };
    expect(changedTags(draft, BLANK_DRAFT).errors).toEqual({ distance: 'Use a whole number.', personnel: expect.stringContaining('two digits') });
  });

  it('in bulk, sends the touched fields even when cleared', () => {
    expect(changedTags(BLANK_DRAFT, BLANK_DRAFT, new Set(['hash'] as const)).update).toEqual({ hash: null });
  });
});
