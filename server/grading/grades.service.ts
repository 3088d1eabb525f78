import type { Grade, GradeInput } from '@shared/api/grading';
import { snapResult, type AssignmentMark, type EffortMark, type GradingSchemeRules, type Mark } from '@shared/grading';
import type { AppContext } from '../core/context';
import { AppError, conflict, notFound, validationFailed } from '../core/errors';
import type { SessionUser } from '../core/route';
import { STARTER_POSITIONS } from './depth-chart.service';
import { findGrade, findGradeContext, writeGrade, type GradeRow } from './grades.repository';
import { DEFAULT_SCHEME_VERSION, schemeRules } from './scheme.service';

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
 * Two round trips when all is well (the context, then the write with its lock check); the current
 * grade is read only to answer a stale version.
 */
export async function saveGrade(app: AppContext, grader: SessionUser, snapId: number, playerId: number, input: GradeInput): Promise<Grade> {
  const snap = await findGradeContext(app.db, snapId, playerId, STARTER_POSITIONS);
  if (!snap) throw notFound('That snap');
  if (snap.grading_locked) await lockedError();
  if (!snap.player_on_team) throw notFound('That player');
  const scheme = { version: snap.scheme_version ?? DEFAULT_SCHEME_VERSION, rules: schemeRules(snap.scheme_rules) };
  let fields = schemeProblems(input, scheme.rules, null);
  // An edit of a grade made under an older scheme keeps what the scheme has since retired (a
  // component, a missed reason, a penalty type) as long as it is unchanged: the desk sends the whole
  // grade back. Only the rare edit that needs it pays for reading the stored grade.
  if (Object.keys(fields).length > 0 && input.version > 0) {
    const stored = await findGrade(app.db, snapId, playerId, grader.id);
    if (stored) fields = schemeProblems(input, scheme.rules, stored);
  }
  if (Object.keys(fields).length > 0) throw validationFailed('Some marks need attention.', fields);

  const result = snapResult(
    { assignment: input.assignment, footwork: input.footwork, hands: input.hands, padLevel: input.padLevel, effort: input.effort, extra: input.extra },
    scheme.rules.resultRule,
  );
  const values = {
    scheme_version: scheme.version,
    position: snap.position,
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
  const written = await writeGrade(app.db, { sessionId: snap.session_id, snapId, playerId, graderId: grader.id }, input.version, values, app.now());
  // The session went away between the two queries: the snap went with it.
  if (!written) throw notFound('That snap');
  if (written.locked) await lockedError();
  if (!written.grade) {
    const current = await findGrade(app.db, snapId, playerId, grader.id);
    throw new AppError(409, 'stale_version', 'This grade was changed elsewhere since you opened it. Choose which to keep.', undefined, { current: current ? toGrade(current) : null });
  }
  // The grader is the signed-in account, whose name the session middleware has just read.
  return toGrade({ ...written.grade, grader_name: grader.name });
}

/** Marks the team's current scheme does not allow, by field; `stored` lends its unchanged retired marks. */
function schemeProblems(input: GradeInput, rules: GradingSchemeRules, stored: GradeRow | null): Record<string, string> {
  const fields: Record<string, string> = {};
  const active = new Set(rules.extraComponents.filter((c) => c.active).map((c) => c.key));
  const storedExtra = (stored?.extra ?? {}) as Record<string, unknown>;
  const unknown = Object.keys(input.extra).filter((k) => !active.has(k) && !(k in storedExtra && storedExtra[k] === input.extra[k]));
  if (unknown.length > 0) fields.extra = `Not a component of the scheme: ${unknown.join(', ')}.`;
  if (input.missedReason !== null && input.assignment !== 'missed') fields.missedReason = 'A reason goes with a missed assignment only.';
  else if (input.missedReason !== null && !rules.missedReasons.includes(input.missedReason) && stored?.missed_reason !== input.missedReason) {
    fields.missedReason = "Choose a reason from the team's list.";
  }
  const storedPenalties = new Set((stored?.penalties ?? []).map((p) => p.type));
  const badPenalty = input.penalties.find((p) => !rules.penaltyTypes.includes(p.type) && !storedPenalties.has(p.type));
  if (badPenalty) fields.penalties = `"${badPenalty.type}" is not on the team's penalty list.`;
  return fields;
}
