import type { TeamStore } from '../../core/team/team-store';

/**
 * Whether a report may ask for its data: once the team's seasons are known (so the first request
 * already names the right season), or when the team cannot load (the API then picks the current one).
 */
export function seasonReady(teams: TeamStore): boolean {
  return teams.team.hasValue() || teams.team.status() === 'error';
}

/** `{ seasonId }` when one is chosen, else nothing: the API's default is the current season. */
export function seasonParams(seasonId: number | null): Record<string, number> {
  return seasonId === null ? {} : { seasonId };
}
