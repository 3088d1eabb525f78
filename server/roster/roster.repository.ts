import type { Database } from '../../db/database';

export function listRosterRows(db: Database, teamId: number, seasonId: number) {
  return db
    .selectFrom('roster_entries as r')
    .innerJoin('players as p', 'p.id', 'r.player_id')
    .leftJoin('memberships as m', (join) => join.onRef('m.player_id', '=', 'p.id').on('m.active', '=', true))
    .leftJoin('users as u', 'u.id', 'm.user_id')
    .select([
      'p.id',
      'p.name',
      'r.jersey',
      'r.positions',
      'r.class_year',
      'r.redshirt',
      'r.height_in',
      'r.weight_lb',
      'r.status',
      'r.season_id',
      'u.email as account_email',
    ])
    .where('p.team_id', '=', teamId)
    .where('r.season_id', '=', seasonId)
    .orderBy('r.jersey')
    .execute();
}

export type RosterRow = Awaited<ReturnType<typeof listRosterRows>>[number];

export function findRosterRow(db: Database, teamId: number, seasonId: number, playerId: number) {
  return listRosterRows(db, teamId, seasonId).then((rows) => rows.find((r) => r.id === playerId));
}
