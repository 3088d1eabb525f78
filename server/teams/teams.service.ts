import type { Season, Team, TeamSharing } from '@shared/api/team';
import type { AppContext } from '../core/context';
import { conflict, notFound } from '../core/errors';
import { isUniqueViolation } from '../core/pg-errors';
import { findCurrentSeason, findSeason, findSharing, findTeam, listSeasons, updateSharing } from './teams.repository';

function toSeason(row: Awaited<ReturnType<typeof listSeasons>>[number]): Season {
  return { id: row.id, name: row.name, startsOn: row.starts_on, endsOn: row.ends_on, isCurrent: row.is_current };
}

export async function describeTeam(app: AppContext, teamId: number): Promise<Team> {
  const team = await findTeam(app.db, teamId);
  if (!team) throw notFound('That team');
  const seasons = (await listSeasons(app.db, teamId)).map(toSeason);
  return { id: team.id, name: team.name, seasons, currentSeasonId: seasons.find((s) => s.isCurrent)?.id ?? null, sharing: toSharing(team) };
}

function toSharing(row: { share_grades_with_players: boolean; share_unit_with_players: boolean }): TeamSharing {
  return { gradesWithPlayers: row.share_grades_with_players, unitWithPlayers: row.share_unit_with_players };
}

/** What the team's staff shares with its players. */
export async function teamSharing(app: AppContext, teamId: number): Promise<TeamSharing> {
  const row = await findSharing(app.db, teamId);
  if (!row) throw notFound('That team');
  return toSharing(row);
}

/** Turns either switch; a switch left out keeps its value. */
export async function setTeamSharing(app: AppContext, teamId: number, change: Partial<TeamSharing>): Promise<TeamSharing> {
  const values = {
    ...(change.gradesWithPlayers !== undefined ? { share_grades_with_players: change.gradesWithPlayers } : {}),
    ...(change.unitWithPlayers !== undefined ? { share_unit_with_players: change.unitWithPlayers } : {}),
  };
  if (Object.keys(values).length > 0) await updateSharing(app.db, teamId, values);
  return teamSharing(app, teamId);
}

/** The season a request is about: the one asked for (it must be this team's) or the current one. */
export async function resolveSeason(app: AppContext, teamId: number, seasonId?: number): Promise<{ id: number; name: string }> {
  const season = seasonId === undefined ? await findCurrentSeason(app.db, teamId) : await findSeason(app.db, teamId, seasonId);
  if (!season) throw notFound(seasonId === undefined ? "This team's current season" : 'That season');
  return season;
}

export async function createSeason(
  app: AppContext,
  teamId: number,
  input: { name: string; startsOn: string; endsOn: string; makeCurrent: boolean },
): Promise<Season> {
  try {
    const row = await app.db.transaction().execute(async (trx) => {
      const hasCurrent = await trx.selectFrom('seasons').select('id').where('team_id', '=', teamId).where('is_current', '=', true).executeTakeFirst();
      const makeCurrent = input.makeCurrent || !hasCurrent;
      if (makeCurrent) await trx.updateTable('seasons').set({ is_current: false }).where('team_id', '=', teamId).execute();
      return trx
        .insertInto('seasons')
        .values({ team_id: teamId, name: input.name, starts_on: input.startsOn, ends_on: input.endsOn, is_current: makeCurrent })
        .returning(['id', 'name', 'starts_on', 'ends_on', 'is_current'])
        .executeTakeFirstOrThrow();
    });
    return toSeason(row);
  } catch (error) {
    if (isUniqueViolation(error)) throw conflict('A season with that name exists.', { name: 'Already used.' });
    throw error;
  }
}
