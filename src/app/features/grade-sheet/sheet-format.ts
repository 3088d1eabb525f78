import type { GradeSheetPlayer } from '@shared/api/grading';
import { COMPONENT_LABELS } from '@shared/grading';

/** 0.794 → "79 %"; null (nothing graded) → "—". */
export function formatRate(rate: number | null): string {
  return rate === null ? '—' : `${Math.round(rate * 100)} %`;
}

/** The winning-grade line in words, never by colour alone. */
export function winningLine(player: Pick<GradeSheetPlayer, 'meetsWinningGrade'>, threshold: number): { symbol: string; text: string; state: 'met' | 'not-met' | 'none' } {
  const line = `Winning grade ${formatRate(threshold)}`;
  if (player.meetsWinningGrade === true) return { symbol: '✓', text: `${line}: met`, state: 'met' };
  if (player.meetsWinningGrade === false) return { symbol: '✗', text: `${line}: not met`, state: 'not-met' };
  return { symbol: '—', text: `${line}: no graded snaps yet`, state: 'none' };
}

const COMPONENT_ORDER = ['assignment', 'footwork', 'hands', 'padLevel'];

/** The sheet's component rows in the desk's order: assignment, technique, team parts, effort. */
export function componentRows(components: GradeSheetPlayer['components'], extraLabels: ReadonlyMap<string, string>): { key: string; label: string; plus: number; minus: number; rate: number | null }[] {
  const keys = Object.keys(components);
  const ordered = [...COMPONENT_ORDER.filter((k) => keys.includes(k)), ...keys.filter((k) => !COMPONENT_ORDER.includes(k) && k !== 'effort'), ...(keys.includes('effort') ? ['effort'] : [])];
  return ordered.map((key) => ({
    key,
    label: key === 'assignment' ? 'Assignment' : key === 'effort' ? 'Effort' : (COMPONENT_LABELS[key] ?? extraLabels.get(key) ?? key),
    ...components[key],
  }));
}

export function byCount(record: Record<string, number>): { name: string; count: number }[] {
  return Object.entries(record)
    .filter(([, n]) => n > 0)
    .map(([name, count]) => ({ name, count }))
    .sort((a, b) => b.count - a.count || a.name.localeCompare(b.name));
}
