import type { DepthChart, DepthChartHistory } from '@shared/api/grading';
import { chartWeekInForce } from '@shared/depth-chart';
import type { Position } from '@shared/roster';
import type { Database } from '../../db/database';
import type { AppContext } from '../core/context';
import { validationFailed } from '../core/errors';
import { resolveSeason } from '../teams/teams.service';
import {
  chartChanges,
  chartRows,
  copyChartWeek,
  insertChartChange,
  lastChangeAt,
  lastGameWeek,
  lockSeasonChart,
  replacePositions,
  savedChartWeeks,
  starterRows,
} from './depth-chart.repository';

const POSITIONS_ON_CHART = ['LT', 'LG', 'C', 'RG', 'RT', 'TE'] as const;

/** The current week of a season's chart: the latest saved (0, the base chart, when none is). */
function currentWeek(saved: readonly number[]): number {
  return saved.length > 0 ? saved[saved.length - 1]! : 0;
}

/**
 * The chart in force at a week (default: the current week). A chart saved for week W is in force
 * from W until a later week's chart, so week 2 shows week 0's chart when only 0 and 4 are saved.
 */
export async function getDepthChart(app: AppContext, teamId: number, seasonId?: number, week?: number): Promise<DepthChart> {
  const season = await resolveSeason(app, teamId, seasonId);
  const [saved, lastGame] = await Promise.all([savedChartWeeks(app.db, season.id), lastGameWeek(app.db, season.id)]);
  const shown = week ?? currentWeek(saved);
  const inForce = chartWeekInForce(saved, shown);
  const [rows, last] = inForce === null ? [[], null] : await Promise.all([chartRows(app.db, season.id, inForce), lastChangeAt(app.db, season.id, inForce)]);
  const positions: DepthChart['positions'] = Object.fromEntries(POSITIONS_ON_CHART.map((p) => [p, [] as DepthChart['positions'][string]]));
  for (const row of rows) positions[row.position]!.push({ playerId: row.player_id, name: row.name, jersey: row.jersey });
  return { seasonId: season.id, week: shown, inForceFromWeek: inForce, savedWeeks: saved, lastGameWeek: lastGame, positions, updatedAt: last?.toISOString() ?? null };
}

/** The positions whose rank-1 players start on the desk, in the order they line up (no TE). */
export const STARTER_POSITIONS: readonly Position[] = ['LT', 'LG', 'C', 'RG', 'RT'];

/**
 * The starter at each line position (rank 1) on the chart in force at `week`, used to fill the
 * grading desk. A session without a week (null or omitted) gets the current chart, the latest saved.
 */
export async function startersOf(db: Database, seasonId: number, week?: number | null): Promise<{ playerId: number; position: Position }[]> {
  const rows = await starterRows(db, seasonId, week ?? null);
  const order: readonly string[] = STARTER_POSITIONS;
  return rows.sort((a, b) => order.indexOf(a.position) - order.indexOf(b.position)).map((r) => ({ playerId: r.player_id, position: r.position as Position }));
}

/**
 * Saves one week's chart (default: the current week). The week gets a full chart of its own: the
 * chart carried into it, with the positions sent replaced; later weeks' own charts are untouched.
 * Every change is kept with who, when, why and the week.
 */
export async function saveDepthChart(
  app: AppContext,
  teamId: number,
  userId: number,
  input: { seasonId?: number; week?: number; positions: Partial<Record<string, number[]>>; reason?: string },
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
  const week = await app.db.transaction().execute(async (trx) => {
    await lockSeasonChart(trx, season.id);
    const saved = await savedChartWeeks(trx, season.id);
    const week = input.week ?? currentWeek(saved);
    const inForce = chartWeekInForce(saved, week);
    const before = inForce === null ? [] : await chartRows(trx, season.id, inForce);
    if (inForce !== null && inForce !== week) await copyChartWeek(trx, season.id, inForce, week);
    await replacePositions(trx, season.id, week, input.positions);
    const after = await chartRows(trx, season.id, week);
    const shape = (list: typeof before) => list.map((r) => ({ position: r.position, rank: r.rank, playerId: r.player_id }));
    await insertChartChange(trx, { seasonId: season.id, week, userId, reason: input.reason ?? null, before: JSON.stringify(shape(before)), after: JSON.stringify(shape(after)) });
    return week;
  });
  return getDepthChart(app, teamId, season.id, week);
}

/** Changes to a season's charts, newest first; `week` keeps those saved for that week's chart. */
export async function depthChartHistory(app: AppContext, teamId: number, seasonId?: number, week?: number): Promise<DepthChartHistory> {
  const season = await resolveSeason(app, teamId, seasonId);
  const rows = await chartChanges(app.db, season.id, week);
  return {
    changes: rows.map((r) => ({
      id: r.id,
      week: r.week,
      by: r.name ?? 'unknown',
      at: r.created_at.toISOString(),
      reason: r.reason,
      before: r.before as DepthChartHistory['changes'][number]['before'],
      after: r.after as DepthChartHistory['changes'][number]['after'],
    })),
  };
}
