import { DEFAULT_PENALTY_TYPES } from './grading';
import { namesRestrictedBlock, SAFETY_POINTS, SAFETY_TEXT } from './safety';

describe('namesRestrictedBlock', () => {
  test('the default penalty list names blocks below the waist and chop blocks', () => {
    expect(namesRestrictedBlock(DEFAULT_PENALTY_TYPES)).toBe(true);
  });

  test.each([['illegal block below the waist'], ['Chop block'], ['cut block on a pass rusher'], ['clipping']])('%s is a restricted block', (type) => {
    expect(namesRestrictedBlock(['holding', type])).toBe(true);
  });

  test('a list of procedure and hands penalties is not', () => {
    expect(namesRestrictedBlock(['holding', 'false start', 'illegal use of hands', 'personal foul'])).toBe(false);
    expect(namesRestrictedBlock([])).toBe(false);
  });
});

describe('the caution text', () => {
  test('covers the rules, contact limits and who decides return to play', () => {
    expect(SAFETY_POINTS.join(' ')).toMatch(/blocks below the waist, chop blocks and helmet contact/);
    expect(SAFETY_TEXT).toMatch(/contact limits follow your state association or conference/);
    expect(SAFETY_TEXT).toMatch(/athletic trainer and physicians decide/);
    expect(SAFETY_TEXT).toMatch(/local rules or licensed practice/);
  });
});
