import type { GradingProgress } from '@shared/api/grading';
import type { AppContext } from '../core/context';
import { notFound, validationFailed } from '../core/errors';
import { participantsBySnap } from './desk.service';
import { currentScheme } from './scheme.service';

/** Cells graded / cells expected (one per lineman on the field per snap), per grader, and the lock. */
export async function gradingProgress(app: AppContext, sessionId: number): Promise<GradingProgress> {
  const session = await app.db.selectFrom('film_sessions').select(['team_id', 'season_id', 'week', 'grading_locked']).where('id', '=', sessionId).executeTakeFirst();
  if (!session) throw notFound('That film session');
  const [snaps, scheme, perGrader, finals, history] = await Promise.all([
    participantsBySnap(app.db, sessionId, session.season_id, session.week),
    currentScheme(app.db, session.team_id),
    app.db
      .selectFrom('grades')
      .innerJoin('snaps', 'snaps.id', 'grades.snap_id')
      .innerJoin('users', 'users.id', 'grades.grader_id')
      .leftJoin('memberships', (j) => j.onRef('memberships.user_id', '=', 'grades.grader_id').on('memberships.team_id', '=', session.team_id))
      .select((eb) => ['grades.grader_id', 'users.name', 'memberships.role', eb.fn.countAll<number>().as('cells')])
      .where('snaps.session_id', '=', sessionId)
      .where('grades.result', 'is not', null)
      .groupBy(['grades.grader_id', 'users.name', 'memberships.role'])
      .execute(),
    app.db.selectFrom('final_grades').select((eb) => eb.fn.countAll<number>().as('n')).where('session_id', '=', sessionId).where('result', 'is not', null).executeTakeFirstOrThrow(),
    app.db
      .selectFrom('grading_lock_events as e')
      .leftJoin('users as u', 'u.id', 'e.by_user')
      .select(['e.action', 'u.name', 'e.created_at', 'e.reason'])
      .where('e.session_id', '=', sessionId)
      .orderBy('e.created_at', 'desc')
      .execute(),
  ]);
  return {
    expectedCells: snaps.reduce((n, s) => n + s.participants.length, 0),
    graders: perGrader.map((g) => ({ graderId: g.grader_id, name: g.name, gradedCells: Number(g.cells), designated: g.role === scheme.designatedGraderRole })),
    finalCells: Number(finals.n),
    locked: session.grading_locked,
    lockHistory: history.map((h) => ({ action: h.action as 'locked' | 'unlocked', by: h.name ?? 'unknown', at: h.created_at.toISOString(), reason: h.reason })),
  };
}

/** Locks a session's grades when done; unlocking needs a reason. Both are recorded with who and when. */
export async function setGradingLock(app: AppContext, sessionId: number, userId: number, locked: boolean, reason?: string): Promise<GradingProgress> {
  if (!locked && !reason) throw validationFailed('Say why the grades are unlocked.', { reason: 'A reason is required to unlock.' });
  await app.db.transaction().execute(async (trx) => {
    const session = await trx.selectFrom('film_sessions').select('grading_locked').where('id', '=', sessionId).forUpdate().executeTakeFirstOrThrow();
    if (session.grading_locked === locked) return;
    await trx.updateTable('film_sessions').set({ grading_locked: locked }).where('id', '=', sessionId).execute();
    await trx.insertInto('grading_lock_events').values({ session_id: sessionId, action: locked ? 'locked' : 'unlocked', by_user: userId, reason: reason ?? null }).execute();
  });
  return gradingProgress(app, sessionId);
}
