import { sql } from 'kysely';
import type { Database } from '../../db/database';
import { chartWeekInForceSql } from './depth-chart.repository';

export function findSnapContext(db: Database, snapId: number) {
  return db
    .selectFrom('snaps')
    .innerJoin('film_sessions', 'film_sessions.id', 'snaps.session_id')
    .select(['snaps.id', 'snaps.session_id', 'snaps.order', 'film_sessions.team_id', 'film_sessions.season_id', 'film_sessions.grading_locked'])
    .where('snaps.id', '=', snapId)
    .executeTakeFirst();
}

const GRADE_COLUMNS = [
  'grades.id',
  'grades.snap_id',
  'grades.player_id',
  'grades.grader_id',
  'grades.scheme_version',
  'grades.position',
  'grades.assignment',
  'grades.missed_reason',
  'grades.footwork',
  'grades.hands',
  'grades.pad_level',
  'grades.extra',
  'grades.effort',
  'grades.knockdowns',
  'grades.pressures_allowed',
  'grades.sacks_allowed',
  'grades.penalties',
  'grades.note',
  'grades.result',
  'grades.version',
  'grades.updated_at',
  'users.name as grader_name',
] as const;

export function gradesQuery(db: Database) {
  return db.selectFrom('grades').innerJoin('users', 'users.id', 'grades.grader_id').select(GRADE_COLUMNS);
}

export type GradeRow = Awaited<ReturnType<ReturnType<typeof gradesQuery>['execute']>>[number];

export function findGrade(db: Database, snapId: number, playerId: number, graderId: number) {
  return gradesQuery(db).where('grades.snap_id', '=', snapId).where('grades.player_id', '=', playerId).where('grades.grader_id', '=', graderId).executeTakeFirst();
}

/**
 * What saving one grade needs to know, in one round trip: the snap's session and its lock, whether
 * the player is on the session's team, the team's current scheme (no row: the team never saved one),
 * and where the player lined up on the snap: the snap's own participants when they list him, else
 * his rank-1 spot among `starterPositions` (the first of them in that order) on the depth chart in
 * force at the session's week (a session without a week: the latest chart).
 */
export function findGradeContext(db: Database, snapId: number, playerId: number, starterPositions: readonly string[]) {
  return db
    .selectFrom('snaps')
    .innerJoin('film_sessions', 'film_sessions.id', 'snaps.session_id')
    .leftJoinLateral(
      (eb) =>
        eb
          .selectFrom('grading_schemes')
          .select(['grading_schemes.version', 'grading_schemes.rules'])
          .whereRef('grading_schemes.team_id', '=', 'film_sessions.team_id')
          .orderBy('grading_schemes.version', 'desc')
          .limit(1)
          .as('scheme'),
      (join) => join.onTrue(),
    )
    .select((eb) => [
      'snaps.id',
      'snaps.session_id',
      'film_sessions.team_id',
      'film_sessions.season_id',
      'film_sessions.grading_locked',
      'scheme.version as scheme_version',
      'scheme.rules as scheme_rules',
      eb
        .exists(eb.selectFrom('players').select('players.id').where('players.id', '=', playerId).whereRef('players.team_id', '=', 'film_sessions.team_id'))
        .as('player_on_team'),
      // snap_participants.position is NOT NULL, so a null here means he is not listed on the snap.
      eb.fn
        .coalesce(
          eb.selectFrom('snap_participants').select('snap_participants.position').whereRef('snap_participants.snap_id', '=', 'snaps.id').where('snap_participants.player_id', '=', playerId),
          eb
            .selectFrom('depth_chart_entries')
            .select('depth_chart_entries.position')
            .whereRef('depth_chart_entries.season_id', '=', 'film_sessions.season_id')
            .where('depth_chart_entries.week', '=', chartWeekInForceSql(sql.ref('film_sessions.season_id'), sql.ref('film_sessions.week')))
            .where('depth_chart_entries.rank', '=', 1)
            .where('depth_chart_entries.player_id', '=', playerId)
            .where('depth_chart_entries.position', 'in', [...starterPositions])
            .orderBy(sql`array_position(${[...starterPositions]}::text[], depth_chart_entries.position)`)
            .limit(1),
        )
        .as('position'),
    ])
    .where('snaps.id', '=', snapId)
    .executeTakeFirst();
}

/** The columns a grade save sets (snap, player and grader name the cell). */
export interface GradeValues {
  scheme_version: number;
  position: string | null;
  assignment: string | null;
  missed_reason: string | null;
  footwork: string | null;
  hands: string | null;
  pad_level: string | null;
  /** JSON text */
  extra: string;
  effort: string | null;
  knockdowns: number;
  pressures_allowed: number;
  sacks_allowed: number;
  /** JSON text */
  penalties: string;
  penalty_count: number;
  note: string | null;
  result: string | null;
}

const WRITTEN_COLUMNS = [
  'id',
  'snap_id',
  'player_id',
  'grader_id',
  'scheme_version',
  'position',
  'assignment',
  'missed_reason',
  'footwork',
  'hands',
  'pad_level',
  'extra',
  'effort',
  'knockdowns',
  'pressures_allowed',
  'sacks_allowed',
  'penalties',
  'note',
  'result',
  'version',
  'updated_at',
] as const;

/** A grade as written, without the grader's name (GradeRow less grader_name). */
export type WrittenGrade = Omit<GradeRow, 'grader_name'>;

/**
 * Writes one grade in a single statement: `version` 0 inserts a new grade (nothing when the cell is
 * already graded), any other version updates the grade only if it is still at that version. Both
 * happen only while the film session is unlocked, read FOR SHARE in the same statement: saves run
 * side by side, while a lock (FOR UPDATE, progress.service) waits for the saves under way to commit
 * and then wins, and a save arriving after it waits for the lock and sees it.
 * Returns whether the session was locked and the written grade (null: locked, or the version was
 * stale); undefined when the session is gone.
 */
export async function writeGrade(
  db: Database,
  cell: { sessionId: number; snapId: number; playerId: number; graderId: number },
  version: number,
  values: GradeValues,
  updatedAt: Date,
): Promise<{ locked: boolean; grade: WrittenGrade | null } | undefined> {
  const withLock = db.with(
    (cte) => cte('lock_state').materialized(),
    (q) => q.selectFrom('film_sessions').select('film_sessions.grading_locked').where('film_sessions.id', '=', cell.sessionId).forShare(),
  );
  const query =
    version === 0
      ? withLock.with('written', (q) =>
          q
            .insertInto('grades')
            .columns(['snap_id', 'player_id', 'grader_id', ...(Object.keys(values) as (keyof GradeValues)[])])
            .expression((eb) =>
              eb
                .selectFrom('lock_state')
                .select([
                  eb.val(cell.snapId).as('snap_id'),
                  eb.val(cell.playerId).as('player_id'),
                  eb.val(cell.graderId).as('grader_id'),
                  ...(Object.keys(values) as (keyof GradeValues)[]).map((column) => eb.val(values[column]).as(column)),
                ])
                .where('lock_state.grading_locked', '=', false),
            )
            .onConflict((oc) => oc.columns(['snap_id', 'player_id', 'grader_id']).doNothing())
            .returning(WRITTEN_COLUMNS),
        )
      : withLock.with('written', (q) =>
          q
            .updateTable('grades')
            .from('lock_state')
            .set((eb) => ({ ...values, version: eb('grades.version', '+', 1), updated_at: updatedAt }))
            .where('grades.snap_id', '=', cell.snapId)
            .where('grades.player_id', '=', cell.playerId)
            .where('grades.grader_id', '=', cell.graderId)
            .where('grades.version', '=', version)
            .where('lock_state.grading_locked', '=', false)
            .returning(WRITTEN_COLUMNS.map((c) => `grades.${c}` as const)),
        );
  const row = await query
    .selectFrom('lock_state')
    .leftJoin('written', (join) => join.onTrue())
    .select(['lock_state.grading_locked as locked', ...WRITTEN_COLUMNS.map((c) => `written.${c}` as const)])
    .executeTakeFirst();
  if (!row) return undefined;
  const { locked, ...grade } = row;
  // A left join makes every written column nullable; id is null exactly when nothing was written.
  return { locked, grade: grade.id === null ? null : (grade as WrittenGrade) };
}
