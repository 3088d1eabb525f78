import type { Scheme, SchemeInput } from '@shared/api/grading';
import { DEFAULT_SCHEME, type GradingSchemeRules } from '@shared/grading';
import type { Database } from '../../db/database';
import type { AppContext } from '../core/context';

export interface CurrentScheme {
  version: number;
  rules: GradingSchemeRules;
  designatedGraderRole: 'admin' | 'coordinator' | 'coach';
}

/** The version a team that never saved a scheme grades under (with DEFAULT_SCHEME). */
export const DEFAULT_SCHEME_VERSION = 1;

/** Stored rules over the defaults: a rule added after a scheme was saved takes its default. */
export function schemeRules(stored: unknown): GradingSchemeRules {
  return { ...DEFAULT_SCHEME, ...(stored as Partial<GradingSchemeRules> | null) };
}

/** The team's current scheme; a team that never saved one grades under version 1, the defaults. */
export async function currentScheme(db: Database, teamId: number): Promise<CurrentScheme & { createdAt: Date | null; createdBy: string | null }> {
  const row = await db
    .selectFrom('grading_schemes')
    .leftJoin('users', 'users.id', 'grading_schemes.created_by')
    .select(['grading_schemes.version', 'grading_schemes.rules', 'grading_schemes.designated_grader_role', 'grading_schemes.created_at', 'users.name as created_by_name'])
    .where('grading_schemes.team_id', '=', teamId)
    .orderBy('grading_schemes.version', 'desc')
    .limit(1)
    .executeTakeFirst();
  if (!row) return { version: DEFAULT_SCHEME_VERSION, rules: DEFAULT_SCHEME, designatedGraderRole: 'coordinator', createdAt: null, createdBy: null };
  return {
    version: row.version,
    rules: schemeRules(row.rules),
    designatedGraderRole: row.designated_grader_role as CurrentScheme['designatedGraderRole'],
    createdAt: row.created_at,
    createdBy: row.created_by_name,
  };
}

function toScheme(s: Awaited<ReturnType<typeof currentScheme>>): Scheme {
  return {
    version: s.version,
    extraComponents: s.rules.extraComponents,
    missedReasons: s.rules.missedReasons,
    penaltyTypes: s.rules.penaltyTypes,
    resultRule: s.rules.resultRule,
    winningThreshold: s.rules.winningThreshold,
    designatedGraderRole: s.designatedGraderRole,
    createdAt: (s.createdAt ?? new Date(0)).toISOString(),
    createdBy: s.createdBy,
  };
}

export async function getScheme(app: AppContext, teamId: number): Promise<Scheme> {
  return toScheme(await currentScheme(app.db, teamId));
}

/**
 * Saves the scheme as a new version. Grades keep the version (and the result) they were made under,
 * so reports stay right after a change; a retired component stays on the old grades.
 */
export async function saveScheme(app: AppContext, teamId: number, userId: number, input: SchemeInput): Promise<Scheme> {
  await app.db.transaction().execute(async (trx) => {
    await trx.selectFrom('teams').select('id').where('id', '=', teamId).forUpdate().execute();
    const current = await currentScheme(trx, teamId);
    const { designatedGraderRole, ...rules } = input;
    await trx
      .insertInto('grading_schemes')
      .values({ team_id: teamId, version: current.version + 1, rules: JSON.stringify(rules), designated_grader_role: designatedGraderRole, created_by: userId })
      .execute();
  });
  return getScheme(app, teamId);
}
