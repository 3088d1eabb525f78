import type { Database } from '../../db/database';

/** The session's heading, and whether the player is on the session's team. */
export function sessionForPlayer(db: Database, sessionId: number, playerId: number) {
  return db
    .selectFrom('film_sessions as s')
    .select((eb) => [
      's.team_id',
      's.title',
      's.date',
      eb.exists(eb.selectFrom('players as p').select('p.id').where('p.id', '=', playerId).whereRef('p.team_id', '=', 's.team_id')).as('player_on_team'),
    ])
    .where('s.id', '=', sessionId)
    .executeTakeFirst();
}

/** The player's final grade (final_grades view) on the snap of each clip that has one. */
export function finalGradesOnClips(db: Database, playerId: number, clipIds: readonly number[]) {
  if (clipIds.length === 0) return Promise.resolve([]);
  return db
    .selectFrom('clips as c')
    .innerJoin('final_grades as g', (j) => j.onRef('g.snap_id', '=', 'c.snap_id').on('g.player_id', '=', playerId))
    .select(['c.id as clip_id', 'g.result', 'g.assignment', 'g.footwork', 'g.hands', 'g.pad_level', 'g.effort', 'g.extra'])
    .where('c.id', 'in', clipIds)
    .execute();
}
