import { sql } from 'kysely';
import { compareCandidates, rateWithInterval } from '@shared/stats';
import type { AppContext } from '../core/context';
import { notFound, validationFailed } from '../core/errors';
import { resolveSeason } from '../teams/teams.service';
import { playerSeasonTallies } from './development.repository';

/**
 * Two to four candidates side by side over a season (default: current): plus rate with a 95 %
 * Wilson interval, per component, the pooled two-proportion z test and P(A's true rate > B's)
 * under Beta(1,1) priors for every pair, with a plain reading and a small-sample warning.
 */
export async function comparePlayers(app: AppContext, teamId: number, playerIds: number[], seasonId?: number) {
  const unique = [...new Set(playerIds)];
  if (unique.length < 2 || unique.length > 4) throw validationFailed('Compare two to four players.', { players: 'Two to four player ids.' });
  const players = await app.db.selectFrom('players').select(['id', 'name']).where('team_id', '=', teamId).where('id', 'in', unique).execute();
  if (players.length !== unique.length) throw notFound('Some of those players');
  const season = await resolveSeason(app, teamId, seasonId);
  const [tallies, components, positions, trend] = await Promise.all([
    playerSeasonTallies(app.db, unique, season.id),
    sql<{ player_id: number; component: string; plus: number; minus: number }>`
      SELECT g.player_id, c.component,
             count(*) FILTER (WHERE c.mark IN ('plus', 'right'))::int AS plus, count(*) FILTER (WHERE c.mark IN ('minus', 'missed', 'loaf'))::int AS minus
      FROM final_grades g JOIN film_sessions fs ON fs.id = g.session_id
      CROSS JOIN LATERAL (VALUES ('assignment', g.assignment), ('footwork', g.footwork), ('hands', g.hands), ('padLevel', g.pad_level), ('effort', g.effort)) AS c(component, mark)
      WHERE g.player_id = ANY(${sql.val(unique)}::bigint[]) AND fs.season_id = ${season.id} AND c.mark IS NOT NULL
      GROUP BY g.player_id, c.component`.execute(app.db),
    sql<{ player_id: number; position: string; snaps: number }>`
      SELECT g.player_id, coalesce(g.position, '?') AS position, count(*)::int AS snaps
      FROM final_grades g JOIN film_sessions fs ON fs.id = g.session_id
      WHERE g.player_id = ANY(${sql.val(unique)}::bigint[]) AND fs.season_id = ${season.id} AND g.result IS NOT NULL
      GROUP BY g.player_id, g.position`.execute(app.db),
    sql<{ player_id: number; session_id: number; date: string; plus: number; minus: number }>`
      SELECT g.player_id, fs.id AS session_id, fs.date::text AS date,
             count(*) FILTER (WHERE g.result = 'plus')::int AS plus, count(*) FILTER (WHERE g.result = 'minus')::int AS minus
      FROM final_grades g JOIN film_sessions fs ON fs.id = g.session_id
      WHERE g.player_id = ANY(${sql.val(unique)}::bigint[]) AND fs.season_id = ${season.id}
      GROUP BY g.player_id, fs.id, fs.date ORDER BY fs.date`.execute(app.db),
  ]);
  const ordered = unique.map((id) => {
    const t = tallies.find((x) => x.player_id === id);
    return { id, name: players.find((p) => p.id === id)!.name, plus: t?.plus ?? 0, minus: t?.minus ?? 0 };
  });
  const comparison = compareCandidates(ordered.map((p) => ({ name: p.name, plus: p.plus, minus: p.minus })));
  return {
    seasonId: season.id,
    players: ordered.map((p) => {
      const summary = rateWithInterval(p.plus, p.minus);
      return {
        playerId: p.id,
        name: p.name,
        snaps: summary.snaps,
        plus: summary.plus,
        rate: summary.rate,
        interval: summary.interval,
        components: Object.fromEntries(
          components.rows.filter((c) => c.player_id === p.id).map((c) => {
            const r = rateWithInterval(c.plus, c.minus);
            return [c.component, { snaps: r.snaps, plus: r.plus, rate: r.rate, interval: r.interval }];
          }),
        ),
        positionsPlayed: Object.fromEntries(positions.rows.filter((x) => x.player_id === p.id).map((x) => [x.position, x.snaps])),
        sparkline: trend.rows.filter((x) => x.player_id === p.id).map((x) => ({ date: x.date, rate: x.plus + x.minus === 0 ? null : x.plus / (x.plus + x.minus) })),
      };
    }),
    pairs: comparison.pairs.map((pair, i) => {
      const [ai, bi] = pairIndexes(ordered.length)[i]!;
      return {
        a: ordered[ai]!.id,
        b: ordered[bi]!.id,
        difference: pair.difference,
        z: pair.z,
        pValue: pair.pValue,
        probabilityABetter: pair.probabilityAHigher,
        reading: pair.reading,
        warning: pair.warning,
      };
    }),
  };
}

/** The pairs compareCandidates makes, in its order: (0,1), (0,2), …, (n−2, n−1). */
function pairIndexes(n: number): [number, number][] {
  const out: [number, number][] = [];
  for (let i = 0; i < n; i += 1) for (let j = i + 1; j < n; j += 1) out.push([i, j]);
  return out;
}
