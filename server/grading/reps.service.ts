import { sql } from 'kysely';
import type { AppContext } from '../core/context';
import { resolveSeason } from '../teams/teams.service';

export interface RepCounts {
  seasonId: number;
  players: {
    playerId: number;
    name: string;
    total: number;
    plus: number;
    byPeriod: Record<string, number>;
    byConcept: Record<string, number>;
    byFront: Record<string, number>;
  }[];
}

/**
 * Practice reps per player in a season: graded practice snaps (final grades), split by practice
 * period, play concept and front faced. Counted in SQL with GROUPING SETS, one pass.
 */
export async function practiceReps(app: AppContext, teamId: number, seasonId?: number): Promise<RepCounts> {
  const season = await resolveSeason(app, teamId, seasonId);
  const rows = await sql<{ player_id: number; name: string; period: string | null; concept: string | null; front: string | null; grouping: number; reps: number; plus: number }>`
    SELECT g.player_id, p.name,
           s.period, concept.name AS concept, front.name AS front,
           GROUPING(s.period, concept.name, front.name) AS grouping,
           count(*)::int AS reps,
           (count(*) FILTER (WHERE g.result = 'plus'))::int AS plus
    FROM final_grades g
    JOIN snaps s ON s.id = g.snap_id
    JOIN film_sessions fs ON fs.id = s.session_id
    JOIN players p ON p.id = g.player_id
    LEFT JOIN tag_list_items concept ON concept.id = s.concept_id
    LEFT JOIN tag_list_items front ON front.id = s.front_id
    WHERE fs.team_id = ${teamId} AND fs.season_id = ${season.id} AND fs.kind = 'practice' AND g.result IS NOT NULL
    GROUP BY GROUPING SETS ((g.player_id, p.name), (g.player_id, p.name, s.period), (g.player_id, p.name, concept.name), (g.player_id, p.name, front.name))
    ORDER BY p.name`.execute(app.db);
  const byPlayer = new Map<number, RepCounts['players'][number]>();
  for (const r of rows.rows) {
    const entry = byPlayer.get(r.player_id) ?? { playerId: r.player_id, name: r.name, total: 0, plus: 0, byPeriod: {}, byConcept: {}, byFront: {} };
    // GROUPING bits, in argument order (period, concept, front): 7 = the player's total.
    if (r.grouping === 7) {
      entry.total = r.reps;
      entry.plus = r.plus;
    } else if (r.grouping === 3) entry.byPeriod[r.period ?? 'no period'] = r.reps;
    else if (r.grouping === 5) entry.byConcept[r.concept ?? 'untagged'] = r.reps;
    else if (r.grouping === 6) entry.byFront[r.front ?? 'untagged'] = r.reps;
    byPlayer.set(r.player_id, entry);
  }
  return { seasonId: season.id, players: [...byPlayer.values()] };
}
