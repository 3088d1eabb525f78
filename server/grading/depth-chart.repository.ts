import { type Expression, sql } from 'kysely';
import type { Database } from '../../db/database';

/** Higher than any week a session can have: a session without a week sees the latest chart. */
const LATEST_WEEK = 32767;

/**
 * SQL for the saved week whose chart is in force at `week` in a season (the greatest saved week at or
 * before it; a null week means the latest), or NULL when none is. Correlated use is fine: the primary
 * key (season_id, week, …) answers it with one index probe.
 */
export function chartWeekInForceSql(seasonId: Expression<number> | number, week: Expression<number | null> | number | null) {
  return sql<number | null>`(SELECT max(w.week) FROM depth_chart_entries w WHERE w.season_id = ${seasonId} AND w.week <= coalesce(${week}::int, ${LATEST_WEEK}))`;
}

/** The weeks of a season that have a chart of their own, ascending. */
export async function savedChartWeeks(db: Database, seasonId: number): Promise<number[]> {
  const rows = await db.selectFrom('depth_chart_entries').select('week').distinct().where('season_id', '=', seasonId).orderBy('week').execute();
  return rows.map((r) => r.week);
}

/** The entries saved for exactly one week, by position and rank, with names and jerseys. */
export function chartRows(db: Database, seasonId: number, week: number) {
  return db
    .selectFrom('depth_chart_entries as d')
    .innerJoin('players as p', 'p.id', 'd.player_id')
    .leftJoin('roster_entries as r', (j) => j.onRef('r.player_id', '=', 'd.player_id').onRef('r.season_id', '=', 'd.season_id'))
    .select(['d.position', 'd.rank', 'd.player_id', 'p.name', 'r.jersey'])
    .where('d.season_id', '=', seasonId)
    .where('d.week', '=', week)
    .orderBy('d.position')
    .orderBy('d.rank')
    .execute();
}

/** Rank-1 players at the line positions (no TE) of the chart in force at `week` (null: the latest). */
export function starterRows(db: Database, seasonId: number, week: number | null) {
  return db
    .selectFrom('depth_chart_entries as d')
    .select(['d.player_id', 'd.position'])
    .where('d.season_id', '=', seasonId)
    .where('d.week', '=', chartWeekInForceSql(seasonId, week))
    .where('d.rank', '=', 1)
    .where('d.position', '<>', 'TE')
    .execute();
}

/** How many line starters (rank 1, no TE) each saved week's chart has (every saved week, even with none). */
export function starterCountsByWeek(db: Database, seasonId: number) {
  return db
    .selectFrom('depth_chart_entries')
    .select(['week', sql<number>`count(*) FILTER (WHERE rank = 1 AND position <> 'TE')::int`.as('starters')])
    .where('season_id', '=', seasonId)
    .groupBy('week')
    .execute();
}

/** The highest week among the season's games, or null. */
export async function lastGameWeek(db: Database, seasonId: number): Promise<number | null> {
  const row = await db
    .selectFrom('film_sessions')
    .select((eb) => eb.fn.max('week').as('week'))
    .where('season_id', '=', seasonId)
    .where('kind', '=', 'game')
    .executeTakeFirst();
  return row?.week ?? null;
}

/** Saves of one season's chart take turns, so two first saves of a week cannot both copy the carried chart. */
export async function lockSeasonChart(db: Database, seasonId: number): Promise<void> {
  await db.selectFrom('seasons').select('id').where('id', '=', seasonId).forUpdate().execute();
}

/** Gives `toWeek` its own copy of the chart saved for `fromWeek` (before replacing some positions). */
export async function copyChartWeek(db: Database, seasonId: number, fromWeek: number, toWeek: number): Promise<void> {
  await db
    .insertInto('depth_chart_entries')
    .columns(['season_id', 'week', 'position', 'rank', 'player_id'])
    .expression((eb) =>
      eb
        .selectFrom('depth_chart_entries')
        .select(['season_id', sql.lit(toWeek).as('week'), 'position', 'rank', 'player_id'])
        .where('season_id', '=', seasonId)
        .where('week', '=', fromWeek),
    )
    .execute();
}

/** Replaces the lists of some positions in one week's chart. */
export async function replacePositions(db: Database, seasonId: number, week: number, positions: Partial<Record<string, number[]>>): Promise<void> {
  const touched = Object.keys(positions);
  if (touched.length > 0) await db.deleteFrom('depth_chart_entries').where('season_id', '=', seasonId).where('week', '=', week).where('position', 'in', touched).execute();
  const rows = Object.entries(positions).flatMap(([position, list]) => (list ?? []).map((playerId, i) => ({ season_id: seasonId, week, position, rank: i + 1, player_id: playerId })));
  if (rows.length > 0) await db.insertInto('depth_chart_entries').values(rows).execute();
}

export function insertChartChange(db: Database, change: { seasonId: number; week: number; userId: number; reason: string | null; before: string; after: string }) {
  return db
    .insertInto('depth_chart_changes')
    .values({ season_id: change.seasonId, week: change.week, changed_by: change.userId, reason: change.reason, before: change.before, after: change.after })
    .execute();
}

/** When the chart saved for a week last changed (null: never through the API, e.g. seeded). */
export async function lastChangeAt(db: Database, seasonId: number, week: number): Promise<Date | null> {
  const row = await db
    .selectFrom('depth_chart_changes')
    .select('created_at')
    .where('season_id', '=', seasonId)
    .where('week', '=', week)
    .orderBy('created_at', 'desc')
    .limit(1)
    .executeTakeFirst();
  return row?.created_at ?? null;
}

/** Changes of a season (or of one week's chart), newest first, with who made them. */
export function chartChanges(db: Database, seasonId: number, week: number | undefined) {
  return db
    .selectFrom('depth_chart_changes as c')
    .leftJoin('users as u', 'u.id', 'c.changed_by')
    .select(['c.id', 'c.week', 'c.reason', 'c.before', 'c.after', 'c.created_at', 'u.name'])
    .where('c.season_id', '=', seasonId)
    .$if(week !== undefined, (q) => q.where('c.week', '=', week!))
    .orderBy('c.created_at', 'desc')
    .orderBy('c.id', 'desc')
    .limit(200)
    .execute();
}
