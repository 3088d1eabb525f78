import { sql } from 'kysely';
import type { Database } from '../../db/database';

/** Per-session plus/minus of one player (final grades), oldest first. */
export function sessionTallies(db: Database, playerId: number, seasonId: number) {
  return sql<{ session_id: number; date: string; kind: string; title: string; plus: number; minus: number }>`
    SELECT fs.id AS session_id, fs.date::text AS date, fs.kind, fs.title,
           count(*) FILTER (WHERE g.result = 'plus')::int AS plus,
           count(*) FILTER (WHERE g.result = 'minus')::int AS minus
    FROM final_grades g JOIN film_sessions fs ON fs.id = g.session_id
    WHERE g.player_id = ${playerId} AND fs.season_id = ${seasonId}
    GROUP BY fs.id, fs.date, fs.kind, fs.title
    HAVING count(*) FILTER (WHERE g.result IS NOT NULL) > 0
    ORDER BY fs.date, fs.id`.execute(db).then((r) => r.rows);
}

/** Per-component plus/minus of one player over a season (effort: a loaf counts as minus). */
export function componentTallies(db: Database, playerId: number, seasonId: number) {
  return sql<Record<string, number>>`
    SELECT count(*) FILTER (WHERE g.assignment = 'right')::int AS assignment_plus, count(*) FILTER (WHERE g.assignment = 'missed')::int AS assignment_minus,
           count(*) FILTER (WHERE g.footwork = 'plus')::int AS footwork_plus, count(*) FILTER (WHERE g.footwork = 'minus')::int AS footwork_minus,
           count(*) FILTER (WHERE g.hands = 'plus')::int AS hands_plus, count(*) FILTER (WHERE g.hands = 'minus')::int AS hands_minus,
           count(*) FILTER (WHERE g.pad_level = 'plus')::int AS pad_level_plus, count(*) FILTER (WHERE g.pad_level = 'minus')::int AS pad_level_minus,
           count(*) FILTER (WHERE g.effort = 'plus')::int AS effort_plus, count(*) FILTER (WHERE g.effort IN ('minus', 'loaf'))::int AS effort_minus
    FROM final_grades g JOIN film_sessions fs ON fs.id = g.session_id
    WHERE g.player_id = ${playerId} AND fs.season_id = ${seasonId}`.execute(db).then((r) => r.rows[0] ?? {});
}

/** Per-session component tallies for the trend charts (one row per session and component). */
export function componentBySession(db: Database, playerId: number, seasonId: number) {
  return sql<{ session_id: number; component: string; plus: number; minus: number }>`
    SELECT g.session_id, c.component,
           count(*) FILTER (WHERE c.mark IN ('plus', 'right'))::int AS plus,
           count(*) FILTER (WHERE c.mark IN ('minus', 'missed', 'loaf'))::int AS minus
    FROM final_grades g
    JOIN film_sessions fs ON fs.id = g.session_id
    CROSS JOIN LATERAL (VALUES ('assignment', g.assignment), ('footwork', g.footwork), ('hands', g.hands), ('padLevel', g.pad_level), ('effort', g.effort)) AS c(component, mark)
    WHERE g.player_id = ${playerId} AND fs.season_id = ${seasonId} AND c.mark IS NOT NULL
    GROUP BY g.session_id, c.component`.execute(db).then((r) => r.rows);
}

export const SPLITS = ['concept', 'front', 'personnel', 'downDistance', 'hash', 'quarter', 'sessionKind', 'position'] as const;
export type Split = (typeof SPLITS)[number];

/**
 * Plus/minus of one player split every way at once with GROUPING SETS: concept, front, personnel,
 * down-and-distance bucket (1st down; 2nd/3rd & short 1–3, medium 4–6, long 7+; 4th down), hash,
 * quarter, game vs practice, position played. Buckets are common practice, no source.
 */
export function splitTallies(db: Database, playerId: number, seasonId: number) {
  return sql<{ split: string; value: string | null; plus: number; minus: number }>`
    WITH rows AS (
      SELECT g.result, g.position, fs.kind, s.hash, s.quarter::text AS quarter, s.personnel,
             concept.name AS concept, front.name AS front,
             CASE WHEN s.down IS NULL THEN NULL WHEN s.down = 1 THEN '1st down' WHEN s.down = 4 THEN '4th down'
                  WHEN s.distance <= 3 THEN '2nd/3rd & short' WHEN s.distance <= 6 THEN '2nd/3rd & medium' ELSE '2nd/3rd & long' END AS dd
      FROM final_grades g
      JOIN snaps s ON s.id = g.snap_id
      JOIN film_sessions fs ON fs.id = g.session_id
      LEFT JOIN tag_list_items concept ON concept.id = s.concept_id
      LEFT JOIN tag_list_items front ON front.id = s.front_id
      WHERE g.player_id = ${playerId} AND fs.season_id = ${seasonId} AND g.result IS NOT NULL)
    SELECT CASE WHEN GROUPING(concept) = 0 THEN 'concept' WHEN GROUPING(front) = 0 THEN 'front' WHEN GROUPING(personnel) = 0 THEN 'personnel'
                WHEN GROUPING(dd) = 0 THEN 'downDistance' WHEN GROUPING(hash) = 0 THEN 'hash' WHEN GROUPING(quarter) = 0 THEN 'quarter'
                WHEN GROUPING(kind) = 0 THEN 'sessionKind' ELSE 'position' END AS split,
           coalesce(concept, front, personnel, dd, hash, quarter, kind, position) AS value,
           count(*) FILTER (WHERE result = 'plus')::int AS plus, count(*) FILTER (WHERE result = 'minus')::int AS minus
    FROM rows
    GROUP BY GROUPING SETS ((concept), (front), (personnel), (dd), (hash), (quarter), (kind), (position))`.execute(db).then((r) => r.rows);
}

/** Plus/minus per player over a season (final grades), for the players asked. */
export function playerSeasonTallies(db: Database, playerIds: number[], seasonId: number) {
  return sql<{ player_id: number; plus: number; minus: number }>`
    SELECT g.player_id, count(*) FILTER (WHERE g.result = 'plus')::int AS plus, count(*) FILTER (WHERE g.result = 'minus')::int AS minus
    FROM final_grades g JOIN film_sessions fs ON fs.id = g.session_id
    WHERE g.player_id = ANY(${sql.val(playerIds)}::bigint[]) AND fs.season_id = ${seasonId}
    GROUP BY g.player_id`.execute(db).then((r) => r.rows);
}
