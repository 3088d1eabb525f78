import { sql } from 'kysely';
import type { Database } from '../../db/database';

/** Per-player counts over the session's final grades, aggregated in SQL. */
export function playerTotals(db: Database, sessionId: number) {
  return db
    .selectFrom('final_grades')
    .select((eb) => [
      'player_id',
      eb.fn.countAll<number>().filterWhere('result', 'is not', null).as('snaps'),
      eb.fn.countAll<number>().filterWhere('result', '=', 'plus').as('plus'),
      eb.fn.countAll<number>().filterWhere('assignment', '=', 'right').as('assignment_plus'),
      eb.fn.countAll<number>().filterWhere('assignment', '=', 'missed').as('assignment_minus'),
      eb.fn.countAll<number>().filterWhere('footwork', '=', 'plus').as('footwork_plus'),
      eb.fn.countAll<number>().filterWhere('footwork', '=', 'minus').as('footwork_minus'),
      eb.fn.countAll<number>().filterWhere('hands', '=', 'plus').as('hands_plus'),
      eb.fn.countAll<number>().filterWhere('hands', '=', 'minus').as('hands_minus'),
      eb.fn.countAll<number>().filterWhere('pad_level', '=', 'plus').as('pad_level_plus'),
      eb.fn.countAll<number>().filterWhere('pad_level', '=', 'minus').as('pad_level_minus'),
      eb.fn.countAll<number>().filterWhere('effort', '=', 'plus').as('effort_plus'),
      eb.fn.countAll<number>().filterWhere('effort', 'in', ['minus', 'loaf']).as('effort_minus'),
      eb.fn.coalesce(eb.fn.sum<number>('knockdowns'), sql<number>`0`).as('knockdowns'),
      eb.fn.coalesce(eb.fn.sum<number>('pressures_allowed'), sql<number>`0`).as('pressures_allowed'),
      eb.fn.coalesce(eb.fn.sum<number>('sacks_allowed'), sql<number>`0`).as('sacks_allowed'),
      eb.fn.coalesce(eb.fn.sum<number>('penalty_count'), sql<number>`0`).as('penalties'),
    ])
    .where('session_id', '=', sessionId)
    .groupBy('player_id')
    .execute();
}

export function extraTotals(db: Database, sessionId: number) {
  return sql<{ player_id: number; key: string; value: string; n: number }>`
    SELECT g.player_id, e.key, e.value, count(*)::int AS n
    FROM final_grades g, jsonb_each_text(g.extra) e
    WHERE g.session_id = ${sessionId} AND e.value IN ('plus', 'minus')
    GROUP BY g.player_id, e.key, e.value`.execute(db).then((r) => r.rows);
}

export function missedByReason(db: Database, sessionId: number) {
  return db
    .selectFrom('final_grades')
    .select((eb) => ['player_id', 'missed_reason', eb.fn.countAll<number>().as('n')])
    .where('session_id', '=', sessionId)
    .where('assignment', '=', 'missed')
    .groupBy(['player_id', 'missed_reason'])
    .execute();
}

export function penaltiesByType(db: Database, sessionId: number) {
  return sql<{ player_id: number; type: string; n: number }>`
    SELECT g.player_id, p->>'type' AS type, count(*)::int AS n
    FROM final_grades g, jsonb_array_elements(g.penalties) p
    WHERE g.session_id = ${sessionId}
    GROUP BY g.player_id, p->>'type'`.execute(db).then((r) => r.rows);
}

export function gradeNotes(db: Database, sessionId: number) {
  return db
    .selectFrom('final_grades')
    .innerJoin('snaps', 'snaps.id', 'final_grades.snap_id')
    .select(['final_grades.player_id', 'snaps.order', 'final_grades.note'])
    .where('final_grades.session_id', '=', sessionId)
    .where('final_grades.note', 'is not', null)
    .orderBy('snaps.order')
    .execute();
}

export function snapTotals(db: Database, sessionId: number) {
  return db
    .selectFrom('final_grades')
    .select((eb) => [
      'snap_id',
      eb.fn.countAll<number>().filterWhere('result', 'is not', null).as('graded'),
      eb.fn.countAll<number>().filterWhere('result', '=', 'plus').as('plus'),
      sql<number[]>`coalesce(array_agg(player_id) FILTER (WHERE result = 'plus'), '{}')`.as('plus_player_ids'),
      sql<number[]>`coalesce(array_agg(player_id) FILTER (WHERE result = 'minus'), '{}')`.as('minus_player_ids'),
    ])
    .where('session_id', '=', sessionId)
    .groupBy('snap_id')
    .execute();
}
