import type { DepthChart } from '@shared/api/grading';
import type { Position } from '@shared/roster';
import type { Database } from '../../db/database';
import type { AppContext } from '../core/context';
import { validationFailed } from '../core/errors';
import { resolveSeason } from '../teams/teams.service';

const POSITIONS_ON_CHART = ['LT', 'LG', 'C', 'RG', 'RT', 'TE'] as const;

async function chartRows(db: Database, seasonId: number) {
  return db
    .selectFrom('depth_chart_entries as d')
    .innerJoin('players as p', 'p.id', 'd.player_id')
    .leftJoin('roster_entries as r', (j) => j.onRef('r.player_id', '=', 'd.player_id').onRef('r.season_id', '=', 'd.season_id'))
    .select(['d.position', 'd.rank', 'd.player_id', 'p.name', 'r.jersey'])
    .where('d.season_id', '=', seasonId)
    .orderBy('d.position')
    .orderBy('d.rank')
    .execute();
}

export async function getDepthChart(app: AppContext, teamId: number, seasonId?: number): Promise<DepthChart> {
  const season = await resolveSeason(app, teamId, seasonId);
  const rows = await chartRows(app.db, season.id);
  const last = await app.db.selectFrom('depth_chart_changes').select('created_at').where('season_id', '=', season.id).orderBy('created_at', 'desc').limit(1).executeTakeFirst();
  const positions: DepthChart['positions'] = Object.fromEntries(POSITIONS_ON_CHART.map((p) => [p, [] as DepthChart['positions'][string]]));
  for (const row of rows) positions[row.position]!.push({ playerId: row.player_id, name: row.name, jersey: row.jersey });
  return { seasonId: season.id, positions, updatedAt: last?.created_at.toISOString() ?? null };
}

/** The positions whose rank-1 players start on the desk, in the order they line up (no TE). */
export const STARTER_POSITIONS: readonly Position[] = ['LT', 'LG', 'C', 'RG', 'RT'];

/** The starter at each line position (rank 1), used to fill the grading desk. */
export async function startersOf(db: Database, seasonId: number): Promise<{ playerId: number; position: Position }[]> {
  const rows = await db.selectFrom('depth_chart_entries').select(['player_id', 'position']).where('season_id', '=', seasonId).where('rank', '=', 1).where('position', '<>', 'TE').execute();
  const order: readonly string[] = STARTER_POSITIONS;
  return rows.sort((a, b) => order.indexOf(a.position) - order.indexOf(b.position)).map((r) => ({ playerId: r.player_id, position: r.position as Position }));
}

/** Replaces the chart of a season; every change is kept with who, when and why. */
export async function saveDepthChart(
  app: AppContext,
  teamId: number,
  userId: number,
  input: { seasonId?: number; positions: Partial<Record<string, number[]>>; reason?: string },
): Promise<DepthChart> {
  const season = await resolveSeason(app, teamId, input.seasonId);
  const ids = [...new Set(Object.values(input.positions).flat())] as number[];
  if (ids.length > 0) {
    const onRoster = await app.db.selectFrom('roster_entries').select('player_id').where('season_id', '=', season.id).where('player_id', 'in', ids).execute();
    const missing = ids.filter((id) => !onRoster.some((r) => r.player_id === id));
    if (missing.length > 0) throw validationFailed('Some players are not on this season\'s roster.', { positions: `Not on the roster: ${missing.join(', ')}.` });
  }
  for (const [position, list] of Object.entries(input.positions)) {
    if (new Set(list).size !== (list ?? []).length) throw validationFailed(`A player is listed twice at ${position}.`, { positions: `Twice at ${position}.` });
  }
  await app.db.transaction().execute(async (trx) => {
    const before = await chartRows(trx, season.id);
    const touched = Object.keys(input.positions);
    if (touched.length > 0) await trx.deleteFrom('depth_chart_entries').where('season_id', '=', season.id).where('position', 'in', touched).execute();
    const rows = Object.entries(input.positions).flatMap(([position, list]) => (list ?? []).map((playerId, i) => ({ season_id: season.id, position, rank: i + 1, player_id: playerId })));
    if (rows.length > 0) await trx.insertInto('depth_chart_entries').values(rows).execute();
    const after = await chartRows(trx, season.id);
    const shape = (list: typeof before) => list.map((r) => ({ position: r.position, rank: r.rank, playerId: r.player_id }));
    await trx
      .insertInto('depth_chart_changes')
      .values({ season_id: season.id, changed_by: userId, reason: input.reason ?? null, before: JSON.stringify(shape(before)), after: JSON.stringify(shape(after)) })
      .execute();
  });
  return getDepthChart(app, teamId, season.id);
}

export async function depthChartHistory(app: AppContext, teamId: number, seasonId?: number) {
  const season = await resolveSeason(app, teamId, seasonId);
  const rows = await app.db
    .selectFrom('depth_chart_changes as c')
    .leftJoin('users as u', 'u.id', 'c.changed_by')
    .select(['c.id', 'c.reason', 'c.before', 'c.after', 'c.created_at', 'u.name'])
    .where('c.season_id', '=', season.id)
    .orderBy('c.created_at', 'desc')
    .limit(200)
    .execute();
  return {
    changes: rows.map((r) => ({ id: r.id, by: r.name ?? 'unknown', at: r.created_at.toISOString(), reason: r.reason, before: r.before, after: r.after })),
  };
}
