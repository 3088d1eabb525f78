import type { FilmSession } from '@shared/api/film';
import type { SessionKind } from '@shared/film';

export type HomeAway = NonNullable<FilmSession['homeAway']>;

/** "vs Ridgefield", "at Ridgefield", "vs Ridgefield (neutral site)". */
export function opponentLine(opponent: string | null, homeAway: HomeAway | null): string {
  if (!opponent) return '';
  if (homeAway === 'away') return `at ${opponent}`;
  if (homeAway === 'neutral') return `vs ${opponent} (neutral site)`;
  return `vs ${opponent}`;
}

/** The title a new session gets when the analyst leaves it empty. */
export function suggestedTitle(kind: SessionKind, date: string, opponent: string | null, homeAway: HomeAway | null, week: number | null): string {
  const weekPart = week === null ? '' : `Week ${week} `;
  if (kind === 'game') return `${weekPart}${opponentLine(opponent, homeAway) || 'game'}`.trim();
  if (kind === 'scrimmage') return `${weekPart}scrimmage${opponent ? ' ' + opponentLine(opponent, homeAway) : ''}`.replace(/^s/, 'S').trim();
  return `${weekPart}practice ${date}`.replace(/^p/, 'P').trim();
}
