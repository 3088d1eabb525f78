import { COMPONENT_LABELS } from './grading';

/**
 * How a player reads one final grade: every part named, every mark as a symbol and a word (grades
 * are never shown by colour alone). The result itself comes from the final_grades view, never from here.
 */
export type MarkValue = 'plus' | 'minus' | 'right' | 'missed' | 'loaf';

/** The parts in the desk's order: assignment, technique, the team's own parts, effort last. */
const FIXED_BEFORE = ['assignment', 'footwork', 'hands', 'padLevel'] as const;

/** A part's name on screen: ours for the fixed parts, the team's own name for its extra parts. */
export function componentLabel(key: string, extraLabels: ReadonlyMap<string, string> = new Map()): string {
  if (key === 'assignment') return 'Assignment';
  if (key === 'effort') return 'Effort';
  return COMPONENT_LABELS[key] ?? extraLabels.get(key) ?? key;
}

/** Keys in the desk's order: the fixed parts, then extra parts as listed, effort last. */
export function componentOrder(keys: readonly string[]): string[] {
  const fixed: readonly string[] = FIXED_BEFORE;
  return [...FIXED_BEFORE.filter((k) => keys.includes(k)), ...keys.filter((k) => !fixed.includes(k) && k !== 'effort'), ...(keys.includes('effort') ? ['effort'] : [])];
}

const MARK_WORDS: Record<MarkValue, { symbol: string; word: string; good: boolean }> = {
  plus: { symbol: '+', word: 'plus', good: true },
  minus: { symbol: '−', word: 'minus', good: false },
  right: { symbol: '✓', word: 'right', good: true },
  missed: { symbol: '✗', word: 'missed', good: false },
  loaf: { symbol: '✗', word: 'loaf', good: false },
};

/** A mark as symbol and word; null (not graded) says so in words too. */
export function markWords(mark: MarkValue | null): { symbol: string; word: string; good: boolean | null } {
  return mark === null ? { symbol: '·', word: 'not graded', good: null } : MARK_WORDS[mark];
}
