import { DEFAULT_MISSED_REASONS, DEFAULT_PENALTY_TYPES } from '@shared/grading';
import { gradeColumns } from './grade-columns';
import { blankDraft, draftResult, rowFill, rowPlus, sameDraft } from './grade-draft';
import { applyCellEdit } from './grade-edits';
import { scheme } from './grading-test-data';

const lists = { missedReasons: DEFAULT_MISSED_REASONS, penaltyTypes: DEFAULT_PENALTY_TYPES };
const columns = gradeColumns(scheme());
const column = (id: string) => columns.find((c) => c.id === id)!;

describe('grade columns and edits', () => {
  it('lays out the base parts, only active extra parts, counts, note and result', () => {
    expect(columns.map((c) => c.label)).toEqual(['Assignment', 'Footwork', 'Hands', 'Pad level', 'Finish', 'Effort', 'Knockdowns', 'Pressures', 'Sacks', 'Penalties', 'Note', 'Result']);
  });

  it('turns plus and minus into the mark each column understands', () => {
    const d = blankDraft();
    expect(applyCellEdit(d, column('assignment'), { kind: 'plus' }, lists)?.assignment).toBe('right');
    expect(applyCellEdit(d, column('assignment'), { kind: 'minus' }, lists)?.assignment).toBe('missed');
    expect(applyCellEdit(d, column('extra:finish'), { kind: 'minus' }, lists)?.extra).toEqual({ finish: 'minus' });
    expect(applyCellEdit({ ...d, knockdowns: 2 }, column('knockdowns'), { kind: 'minus' }, lists)?.knockdowns).toBe(1);
    expect(applyCellEdit(d, column('knockdowns'), { kind: 'minus' }, lists)?.knockdowns).toBe(0);
    expect(applyCellEdit(d, column('result'), { kind: 'plus' }, lists)).toBeNull();
    expect(applyCellEdit(d, column('note'), { kind: 'clear' }, lists)).toBeNull();
  });

  it('picks missed reasons and penalty types by number, and steps marks in a cycle', () => {
    const missed = applyCellEdit(blankDraft(), column('assignment'), { kind: 'pick', index: 2 }, lists);
    expect(missed).toMatchObject({ assignment: 'missed', missedReason: 'communication' });
    expect(applyCellEdit(missed!, column('assignment'), { kind: 'plus' }, lists)?.missedReason).toBeNull();
    const penalized = applyCellEdit(blankDraft(), column('penalties'), { kind: 'pick', index: 0 }, lists);
    expect(penalized?.penalties).toEqual([{ type: 'holding' }]);
    expect(applyCellEdit(blankDraft(), column('penalties'), { kind: 'pick', index: 30 }, lists)).toBeNull();
    let effort = blankDraft();
    const seen: (string | null)[] = [];
    for (let i = 0; i < 4; i++) {
      effort = applyCellEdit(effort, column('effort'), { kind: 'cycle' }, lists)!;
      seen.push(effort.effort);
    }
    expect(seen).toEqual(['plus', 'minus', 'loaf', null]);
  });

  it('row plus overwrites; fill keeps the marks already set; the live result follows the rule', () => {
    const withMinus = { ...blankDraft(), hands: 'minus' as const, knockdowns: 1 };
    const plus = rowPlus(withMinus, ['finish']);
    expect(plus).toMatchObject({ assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', extra: { finish: 'plus' }, effort: 'plus', knockdowns: 1 });
    const filled = rowFill(withMinus, ['finish']);
    expect(filled.hands).toBe('minus');
    expect(draftResult(plus, { kind: 'strict' }, ['finish'])).toBe('plus');
    expect(draftResult(filled, { kind: 'strict' }, ['finish'])).toBe('minus');
    expect(draftResult(blankDraft(), { kind: 'strict' }, [])).toBeNull();
    // Points: 4 parts plus (1 each) and a minus on hands (−1) → 3 points, the pass line.
    const points = { kind: 'points' as const, weights: { footwork: 1, hands: 1, padLevel: 1, finish: 1, effort: 1 }, missedPenalty: 3, passPoints: 3 };
    expect(draftResult(filled, points, ['finish'])).toBe('plus');
  });

  it('treats key order and empty extras as the same grade', () => {
    expect(sameDraft({ ...blankDraft(), extra: { finish: null } }, blankDraft())).toBe(true);
    expect(sameDraft({ ...blankDraft(), extra: { finish: 'plus' } }, blankDraft())).toBe(false);
  });
});
