import type { Database } from '../../db/database';

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
