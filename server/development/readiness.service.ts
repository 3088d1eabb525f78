import { sql } from 'kysely';
import { chartWeekInForce } from '@shared/depth-chart';
import { linemanResults, rateWithInterval, resultScores, unitGrade, weakestLinkCounts } from '@shared/stats';
import type { AppContext } from '../core/context';
import { starterCountsByWeek } from '../grading/depth-chart.repository';
import { currentScheme } from '../grading/scheme.service';
import { resolveSeason } from '../teams/teams.service';

/** A cell with fewer reps than this is marked "few reps": where practice reps should go. */
export const FEW_REPS = 12;

/**
 * The readiness matrix: play concepts × fronts faced, each cell the reps (game and practice, every
 * lineman's graded snap counts once) and the plus rate with its interval; cells with few reps or a
 * rate under the team's winning grade are marked. One GROUP BY over the season's final grades.
 */
export async function readinessMatrix(app: AppContext, teamId: number, seasonId?: number) {
  const season = await resolveSeason(app, teamId, seasonId);
  const [cells, lists, scheme] = await Promise.all([
    sql<{ concept_id: number; front_id: number; kind: string | null; plus: number; minus: number }>`
      SELECT s.concept_id, s.front_id, fs.kind,
             count(*) FILTER (WHERE g.result = 'plus')::int AS plus, count(*) FILTER (WHERE g.result = 'minus')::int AS minus
      FROM final_grades g JOIN snaps s ON s.id = g.snap_id JOIN film_sessions fs ON fs.id = g.session_id
      WHERE fs.team_id = ${teamId} AND fs.season_id = ${season.id} AND s.concept_id IS NOT NULL AND s.front_id IS NOT NULL AND g.result IS NOT NULL
      GROUP BY GROUPING SETS ((s.concept_id, s.front_id), (s.concept_id, s.front_id, fs.kind))`.execute(app.db),
    app.db.selectFrom('tag_list_items').select(['id', 'kind', 'name', 'active', 'sort_order']).where('team_id', '=', teamId).where('kind', 'in', ['concept', 'front']).orderBy('sort_order').execute(),
    currentScheme(app.db, teamId),
  ]);
  const threshold = scheme.rules.winningThreshold;
  const concepts = lists.filter((l) => l.kind === 'concept');
  const fronts = lists.filter((l) => l.kind === 'front');
  const totals = cells.rows.filter((c) => c.kind === null);
  const used = (id: number, key: 'concept_id' | 'front_id') => totals.some((c) => c[key] === id);
  const rows = concepts.filter((c) => c.active || used(c.id, 'concept_id'));
  const columns = fronts.filter((f) => f.active || used(f.id, 'front_id'));
  return {
    seasonId: season.id,
    winningThreshold: threshold,
    fewReps: FEW_REPS,
    concepts: rows.map((c) => ({ id: c.id, name: c.name })),
    fronts: columns.map((f) => ({ id: f.id, name: f.name })),
    cells: rows.flatMap((c) =>
      columns.map((f) => {
        const total = totals.find((x) => x.concept_id === c.id && x.front_id === f.id);
        const game = cells.rows.find((x) => x.concept_id === c.id && x.front_id === f.id && x.kind === 'game');
        const practice = cells.rows.find((x) => x.concept_id === c.id && x.front_id === f.id && x.kind === 'practice');
        const r = rateWithInterval(total?.plus ?? 0, total?.minus ?? 0);
        return {
          conceptId: c.id,
          frontId: f.id,
          reps: r.snaps,
          gameReps: (game?.plus ?? 0) + (game?.minus ?? 0),
          practiceReps: (practice?.plus ?? 0) + (practice?.minus ?? 0),
          plus: r.plus,
          rate: r.rate,
          interval: r.interval,
          fewReps: r.snaps < FEW_REPS,
          belowWinningGrade: r.rate !== null && r.rate < threshold,
        };
      }),
    ),
  };
}

/**
 * The line by game: unit grade (snaps on which every lineman on the field graded plus, by the shared
 * rule in unitSnapOutcome — the Grade Sheet uses the same), who was the weakest link most often, and
 * missed assignments by position and reason. The unit numbers come from one row per snap (its listed
 * linemen and who graded plus or minus), never from every grade.
 */
export async function lineDashboard(app: AppContext, teamId: number, seasonId?: number) {
  const season = await resolveSeason(app, teamId, seasonId);
  const [snapRows, missed, startersByWeek, players] = await Promise.all([
    sql<{ session_id: number; title: string; date: string; week: number | null; listed: number; plus_ids: number[]; minus_ids: number[] }>`
      SELECT fs.id AS session_id, fs.title, fs.date::text AS date, fs.week,
             (SELECT count(*)::int FROM snap_participants sp WHERE sp.snap_id = g.snap_id) AS listed,
             coalesce(array_agg(g.player_id) FILTER (WHERE g.result = 'plus'), '{}') AS plus_ids,
             coalesce(array_agg(g.player_id) FILTER (WHERE g.result = 'minus'), '{}') AS minus_ids
      FROM final_grades g JOIN film_sessions fs ON fs.id = g.session_id
      WHERE fs.team_id = ${teamId} AND fs.season_id = ${season.id} AND fs.kind = 'game' AND g.result IS NOT NULL
      GROUP BY fs.id, fs.title, fs.date, g.snap_id
      ORDER BY fs.date, fs.id`.execute(app.db),
    sql<{ position: string | null; reason: string | null; n: number }>`
      SELECT g.position, g.missed_reason AS reason, count(*)::int AS n
      FROM final_grades g JOIN film_sessions fs ON fs.id = g.session_id
      WHERE fs.team_id = ${teamId} AND fs.season_id = ${season.id} AND g.assignment = 'missed'
      GROUP BY g.position, g.missed_reason ORDER BY n DESC`.execute(app.db),
    starterCountsByWeek(app.db, season.id),
    app.db.selectFrom('players').select(['id', 'name']).where('team_id', '=', teamId).execute(),
  ]);
  // A snap with no listed linemen was played by the starters of the chart in force at its game's
  // week (as on the Grading Desk).
  const starterCount = new Map(startersByWeek.map((w) => [w.week, Number(w.starters)]));
  const startersAt = (week: number | null) => starterCount.get(chartWeekInForce([...starterCount.keys()], week) ?? -1) ?? 0;
  const snaps = snapRows.rows.map((r) => {
    const plusIds = r.plus_ids.map(Number);
    const minusIds = r.minus_ids.map(Number);
    return { ...r, onField: r.listed > 0 ? r.listed : startersAt(r.week), graded: plusIds.length + minusIds.length, plus: plusIds.length, plusIds, minusIds };
  });
  const games = [...new Map(snaps.map((s) => [s.session_id, s])).values()].map((game) => {
    const unit = unitGrade(snaps.filter((s) => s.session_id === game.session_id));
    return { sessionId: game.session_id, title: game.title, date: game.date, snaps: unit.counted, allPlus: unit.allPlus, incomplete: unit.incomplete, rate: unit.rate };
  });
  const weakest = weakestLinkCounts(
    snaps.map((s) => resultScores(linemanResults(s.plusIds, s.minusIds))),
  );
  const name = new Map(players.map((p) => [p.id, p.name]));
  return {
    seasonId: season.id,
    games,
    weakestLinks: Object.entries(weakest)
      .map(([id, count]) => ({ playerId: Number(id), name: name.get(Number(id)) ?? `Player ${id}`, snaps: count }))
      .sort((a, b) => b.snaps - a.snaps || a.name.localeCompare(b.name)),
    missedAssignments: missed.rows.map((m) => ({ position: m.position ?? 'unknown', reason: m.reason ?? 'no reason given', count: m.n })),
  };
}
