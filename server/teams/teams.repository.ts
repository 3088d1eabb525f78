import type { Database } from '../../db/database';

export function findTeam(db: Database, teamId: number) {
  return db.selectFrom('teams').select(['id', 'name', 'share_grades_with_players', 'share_unit_with_players']).where('id', '=', teamId).executeTakeFirst();
}

export function findSharing(db: Database, teamId: number) {
  return db.selectFrom('teams').select(['share_grades_with_players', 'share_unit_with_players']).where('id', '=', teamId).executeTakeFirst();
}

export async function updateSharing(db: Database, teamId: number, values: { share_grades_with_players?: boolean; share_unit_with_players?: boolean }): Promise<void> {
  await db.updateTable('teams').set(values).where('id', '=', teamId).execute();
}

export function listSeasons(db: Database, teamId: number) {
  return db
    .selectFrom('seasons')
    .select(['id', 'name', 'starts_on', 'ends_on', 'is_current'])
    .where('team_id', '=', teamId)
    .orderBy('starts_on', 'desc')
    .execute();
}

export function findSeason(db: Database, teamId: number, seasonId: number) {
  return db.selectFrom('seasons').select(['id', 'name']).where('team_id', '=', teamId).where('id', '=', seasonId).executeTakeFirst();
}

export function findCurrentSeason(db: Database, teamId: number) {
  return db.selectFrom('seasons').select(['id', 'name']).where('team_id', '=', teamId).where('is_current', '=', true).executeTakeFirst();
}
