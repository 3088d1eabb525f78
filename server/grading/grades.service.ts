import type { Grade, GradeInput } from '@shared/api/grading';
import { snapResult, type AssignmentMark, type EffortMark, type Mark } from '@shared/grading';
import type { AppContext } from '../core/context';
import { AppError, conflict, notFound, validationFailed } from '../core/errors';
import type { SessionUser } from '../core/route';
import { startersOf } from './depth-chart.service';
import { findGrade, findSnapContext, type GradeRow } from './grades.repository';
import { currentScheme } from './scheme.service';

export function toGrade(row: GradeRow): Grade {
  return {
    id: row.id,
    snapId: row.snap_id,
    playerId: row.player_id,
    graderId: row.grader_id,
    graderName: row.grader_name,
    assignment: row.assignment as AssignmentMark | null,
    missedReason: row.missed_reason,
    footwork: row.footwork as Mark | null,
    hands: row.hands as Mark | null,
    padLevel: row.pad_level as Mark | null,
    extra: row.extra as Record<string, Mark | null>,
    effort: row.effort as EffortMark | null,
    knockdowns: row.knockdowns,
    pressuresAllowed: row.pressures_allowed,
    sacksAllowed: row.sacks_allowed,
    penalties: row.penalties,
    note: row.note,
    result: row.result as Grade['result'],
    schemeVersion: row.scheme_version,
    version: row.version,
    updatedAt: row.updated_at.toISOString(),
  };
}

export async function lockedError(): Promise<never> {
  throw conflict('Grading of this session is locked. Ask the coordinator to unlock it.');
}

/**
 * Saves the signed-in coach's grade of one player on one snap. Optimistic concurrency: a new grade
 * is version 0; an edit names the version it was made from, and a stale one is refused with 409 and
 * the current grade, so nothing is overwritten silently. The result is computed here with the
 * team's current scheme and stored with that scheme's version.
 */
export async function saveGrade(app: AppContext, grader: SessionUser, snapId: number, playerId: number, input: GradeInput): Promise<Grade> {
  const snap = await findSnapContext(app.db, snapId);
  if (!snap) throw notFound('That snap');
  if (snap.grading_locked) await lockedError();
  const player = await app.db.selectFrom('players').select('id').where('id', '=', playerId).where('team_id', '=', snap.team_id).executeTakeFirst();
  if (!player) throw notFound('That player');
  const scheme = await currentScheme(app.db, snap.team_id);
  const fields: Record<string, string> = {};
  const active = new Set(scheme.rules.extraComponents.filter((c) => c.active).map((c) => c.key));
  const unknown = Object.keys(input.extra).filter((k) => !active.has(k));
  if (unknown.length > 0) fields.extra = `Not a component of the scheme: ${unknown.join(', ')}.`;
  if (input.missedReason !== null && input.assignment !== 'missed') fields.missedReason = 'A reason goes with a missed assignment only.';
  if (input.missedReason !== null && !scheme.rules.missedReasons.includes(input.missedReason)) fields.missedReason = "Choose a reason from the team's list.";
  const badPenalty = input.penalties.find((p) => !scheme.rules.penaltyTypes.includes(p.type));
  if (badPenalty) fields.penalties = `"${badPenalty.type}" is not on the team's penalty list.`;
  if (Object.keys(fields).length > 0) throw validationFailed('Some marks need attention.', fields);

  const result = snapResult(
    { assignment: input.assignment, footwork: input.footwork, hands: input.hands, padLevel: input.padLevel, effort: input.effort, extra: input.extra },
    scheme.rules.resultRule,
  );
  const position = await positionOn(app, snap.id, snap.season_id, playerId);
  const values = {
    scheme_version: scheme.version,
    position,
    assignment: input.assignment,
    missed_reason: input.missedReason,
    footwork: input.footwork,
    hands: input.hands,
    pad_level: input.padLevel,
    extra: JSON.stringify(input.extra),
    effort: input.effort,
    knockdowns: input.knockdowns,
    pressures_allowed: input.pressuresAllowed,
    sacks_allowed: input.sacksAllowed,
    penalties: JSON.stringify(input.penalties),
    penalty_count: input.penalties.length,
    note: input.note,
    result,
  };
  const saved = await app.db.transaction().execute(async (trx) => {
    // FOR SHARE: saves run side by side, while a lock (FOR UPDATE) waits for them and then wins.
    const session = await trx.selectFrom('film_sessions').select('grading_locked').where('id', '=', snap.session_id).forShare().executeTakeFirstOrThrow();
    if (session.grading_locked) await lockedError();
    return input.version === 0
      ? await trx
          .insertInto('grades')
          .values({ snap_id: snapId, player_id: playerId, grader_id: grader.id, ...values })
          .onConflict((oc) => oc.columns(['snap_id', 'player_id', 'grader_id']).doNothing())
          .returning('id')
          .executeTakeFirst()
      : await trx
          .updateTable('grades')
          .set((eb) => ({ ...values, version: eb('version', '+', 1), updated_at: app.now() }))
          .where('snap_id', '=', snapId)
          .where('player_id', '=', playerId)
          .where('grader_id', '=', grader.id)
          .where('version', '=', input.version)
          .returning('id')
          .executeTakeFirst();
  });
  const current = await findGrade(app.db, snapId, playerId, grader.id);
  if (!saved) {
    throw new AppError(409, 'stale_version', 'This grade was changed elsewhere since you opened it. Choose which to keep.', undefined, { current: current ? toGrade(current) : null });
  }
  return toGrade(current!);
}

/** The position a player lined up at on a snap: from the snap's participants, else the depth chart. */
async function positionOn(app: AppContext, snapId: number, seasonId: number, playerId: number): Promise<string | null> {
  const listed = await app.db.selectFrom('snap_participants').select('position').where('snap_id', '=', snapId).where('player_id', '=', playerId).executeTakeFirst();
  if (listed) return listed.position;
  const starter = (await startersOf(app.db, seasonId)).find((s) => s.playerId === playerId);
  return starter?.position ?? null;
}
