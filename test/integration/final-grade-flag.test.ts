import fc from 'fast-check';
import { sql } from 'kysely';
import pg from 'pg';
import type { Database } from '../../db/database';
import { createTeamFixture, type TeamFixture } from '../support/fixtures';
import { createTestDatabase, type TestDatabase } from '../support/test-database';

/**
 * The final-grade flag (db/migrations/20261204T000000_final_grade_flag.ts) against an oracle: the
 * rule exactly as the original final_grades view ranked it on every read (DISTINCT ON in
 * 20261202T010000_grading.ts). Random sequences of what can change the answer — grades added,
 * removed or moved to another grader, a grader's role changed, a new scheme naming another
 * designated role — must leave the flag equal to the oracle every time; and two coaches saving the
 * same cell at the same moment must end with exactly one final grade.
 */
jest.setTimeout(120_000);

let tdb: TestDatabase;
let db: Database;
let team: TeamFixture;
let snapIds: number[];
let graders: number[];

/** The original view's query: the final grade of each snap and player, ranked at read time. */
async function oracleFinalIds(): Promise<number[]> {
  const { rows } = await sql<{ id: number }>`
    SELECT DISTINCT ON (g.snap_id, g.player_id) g.id
    FROM grades g
    JOIN snaps s ON s.id = g.snap_id
    JOIN film_sessions fs ON fs.id = s.session_id
    LEFT JOIN LATERAL (
      SELECT gs.designated_grader_role FROM grading_schemes gs
      WHERE gs.team_id = fs.team_id ORDER BY gs.version DESC LIMIT 1
    ) scheme ON true
    LEFT JOIN memberships m ON m.user_id = g.grader_id AND m.team_id = fs.team_id
    WHERE fs.team_id = ${team.teamId}
    ORDER BY g.snap_id, g.player_id,
      (m.role IS NOT DISTINCT FROM coalesce(scheme.designated_grader_role, 'coordinator')) DESC,
      g.created_at, g.id`.execute(db);
  return rows.map((r) => Number(r.id)).sort((a, b) => a - b);
}

async function flaggedFinalIds(): Promise<number[]> {
  const rows = await db
    .selectFrom('final_grades')
    .innerJoin('film_sessions', 'film_sessions.id', 'final_grades.session_id')
    .select('final_grades.id')
    .where('film_sessions.team_id', '=', team.teamId)
    .execute();
  return rows.map((r) => Number(r.id)).sort((a, b) => a - b);
}

beforeAll(async () => {
  tdb = await createTestDatabase();
  db = tdb.handle.db;
  team = await createTeamFixture(db, 'Flag');
  const session = await db
    .insertInto('film_sessions')
    .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 2 vs Slate Hollow', date: '2026-09-11', opponent: 'Slate Hollow' })
    .returning('id')
    .executeTakeFirstOrThrow();
  snapIds = [];
  for (let order = 1; order <= 3; order += 1) snapIds.push((await db.insertInto('snaps').values({ session_id: session.id, order }).returning('id').executeTakeFirstOrThrow()).id);
  // Graders: the fixture's coordinator, coach and admin, plus one more coach.
  const extra = await db.insertInto('users').values({ email: `second.coach.${team.teamId}@flag.test`, name: 'Second Coach', password_hash: 'x' }).returning('id').executeTakeFirstOrThrow();
  await db.insertInto('memberships').values({ user_id: extra.id, team_id: team.teamId, role: 'coach' }).execute();
  graders = [team.accounts.coordinator.userId, team.accounts.coach.userId, team.accounts.admin.userId, extra.id];
});

afterAll(async () => {
  await tdb?.drop();
});

type Step =
  | { kind: 'grade'; snap: number; player: number; grader: number; minutesAgo: number }
  | { kind: 'ungrade'; pick: number }
  | { kind: 'regrade'; pick: number; grader: number }
  | { kind: 'role'; grader: number; role: 'admin' | 'coordinator' | 'coach' }
  | { kind: 'scheme'; role: 'admin' | 'coordinator' | 'coach' }
  | { kind: 'edit'; pick: number };

const roles = fc.constantFrom('admin' as const, 'coordinator' as const, 'coach' as const);
const step: fc.Arbitrary<Step> = fc.oneof(
  // Few cells, so that coaches often grade the same one and the rule has something to decide.
  { weight: 4, arbitrary: fc.record({ kind: fc.constant('grade' as const), snap: fc.nat(1), player: fc.nat(1), grader: fc.nat(3), minutesAgo: fc.nat(5) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('ungrade' as const), pick: fc.nat(50) }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('regrade' as const), pick: fc.nat(50), grader: fc.nat(3) }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('role' as const), grader: fc.nat(3), role: roles }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('scheme' as const), role: roles }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('edit' as const), pick: fc.nat(50) }) },
);

async function teamGradeIds(): Promise<number[]> {
  const rows = await db.selectFrom('grades').select('id').where('snap_id', 'in', snapIds).orderBy('id').execute();
  return rows.map((r) => Number(r.id));
}

/** Every run starts alike: no grades, no scheme (the coordinator is designated), the fixture's roles. */
async function resetCells(): Promise<void> {
  await db.deleteFrom('grades').where('snap_id', 'in', snapIds).execute();
  await db.deleteFrom('grading_schemes').where('team_id', '=', team.teamId).execute();
  for (const [i, role] of (['coordinator', 'coach', 'admin', 'coach'] as const).entries()) await apply({ kind: 'role', grader: i, role });
}

async function apply(s: Step): Promise<void> {
  switch (s.kind) {
    case 'grade':
      await db
        .insertInto('grades')
        .values({
          snap_id: snapIds[s.snap]!,
          player_id: team.playerIds[s.player]!,
          grader_id: graders[s.grader]!,
          scheme_version: 1,
          assignment: 'right',
          result: 'plus',
          // Several grades share a creation time: the id settles the tie, as in the rule.
          created_at: sql<Date>`date_trunc('minute', now()) - make_interval(mins => ${s.minutesAgo})` as never,
        })
        .onConflict((oc) => oc.columns(['snap_id', 'player_id', 'grader_id']).doNothing())
        .execute();
      return;
    case 'ungrade':
    case 'regrade':
    case 'edit': {
      const ids = await teamGradeIds();
      if (ids.length === 0) return;
      const id = ids[s.pick % ids.length]!;
      if (s.kind === 'ungrade') await db.deleteFrom('grades').where('id', '=', id).execute();
      else if (s.kind === 'edit') await db.updateTable('grades').set({ result: 'minus', assignment: 'missed', version: sql<number>`version + 1` as never }).where('id', '=', id).execute();
      else {
        // Moving a grade to another grader (a data fix): skipped when that grader has the cell already.
        await sql`UPDATE grades SET grader_id = ${graders[s.grader]!} WHERE id = ${id}
                  AND NOT EXISTS (SELECT 1 FROM grades o WHERE o.snap_id = grades.snap_id AND o.player_id = grades.player_id AND o.grader_id = ${graders[s.grader]!})`.execute(db);
      }
      return;
    }
    case 'role':
      await db.updateTable('memberships').set({ role: s.role }).where('user_id', '=', graders[s.grader]!).where('team_id', '=', team.teamId).execute();
      return;
    case 'scheme': {
      const last = await db.selectFrom('grading_schemes').select((eb) => eb.fn.max('version').as('v')).where('team_id', '=', team.teamId).executeTakeFirst();
      await db
        .insertInto('grading_schemes')
        .values({ team_id: team.teamId, version: Number(last?.v ?? 0) + 1, rules: JSON.stringify({}), designated_grader_role: s.role })
        .execute();
      return;
    }
  }
}

test('after any sequence of changes the stored flag picks what the original view picked', async () => {
  // How often a cell had grades by two or more coaches when compared: the rule was really exercised.
  let contested = 0;
  await fc.assert(
    fc.asyncProperty(fc.array(step, { minLength: 1, maxLength: 20 }), async (steps) => {
      await resetCells();
      for (const s of steps) {
        await apply(s);
        expect(await flaggedFinalIds()).toEqual(await oracleFinalIds());
        const cells = await db.selectFrom('grades').select(['snap_id', 'player_id']).where('snap_id', 'in', snapIds).groupBy(['snap_id', 'player_id']).having((eb) => eb.fn.countAll(), '>', 1).execute();
        if (cells.length > 0) contested += 1;
      }
    }),
    { numRuns: 60, seed: 20261204 },
  );
  expect(contested).toBeGreaterThan(10);
});

test('hand-worked: the designated grade wins, loses its place with its role, and gives it back with the scheme', async () => {
  await db.deleteFrom('grades').where('snap_id', 'in', snapIds).execute();
  await db.deleteFrom('grading_schemes').where('team_id', '=', team.teamId).execute();
  await apply({ kind: 'role', grader: 0, role: 'coordinator' });
  await apply({ kind: 'role', grader: 1, role: 'coach' });
  // The coach graded first (five minutes ago), the coordinator later (one minute ago).
  await apply({ kind: 'grade', snap: 0, player: 0, grader: 1, minutesAgo: 5 });
  await apply({ kind: 'grade', snap: 0, player: 0, grader: 0, minutesAgo: 1 });
  const finalGrader = async () =>
    (await db.selectFrom('final_grades').select('grader_id').where('snap_id', '=', snapIds[0]!).where('player_id', '=', team.playerIds[0]!).execute()).map((r) => r.grader_id);
  // No scheme yet: the coordinator is designated by default, so his later grade counts.
  expect(await finalGrader()).toEqual([graders[0]]);
  // He becomes a position coach: nobody is designated, the earliest grade (the coach's) counts.
  await apply({ kind: 'role', grader: 0, role: 'coach' });
  expect(await finalGrader()).toEqual([graders[1]]);
  // A scheme that designates coaches: both are coaches now, so the earliest still counts.
  await apply({ kind: 'scheme', role: 'coach' });
  expect(await finalGrader()).toEqual([graders[1]]);
  // The first coach is made admin: the other is now the only coach, the designated role, so his counts.
  await apply({ kind: 'role', grader: 1, role: 'admin' });
  expect(await finalGrader()).toEqual([graders[0]]);
  // A scheme that designates admins: the first coach's (now admin's) grade counts again.
  await apply({ kind: 'scheme', role: 'admin' });
  expect(await finalGrader()).toEqual([graders[1]]);
  expect(await flaggedFinalIds()).toEqual(await oracleFinalIds());
});

test('two coaches saving the same cell at the same moment leave exactly one final grade, the designated one', async () => {
  await db.deleteFrom('grades').where('snap_id', 'in', snapIds).execute();
  await db.updateTable('memberships').set({ role: 'coordinator' }).where('user_id', '=', graders[0]!).execute();
  await db.updateTable('memberships').set({ role: 'coach' }).where('user_id', '=', graders[1]!).execute();
  await db.insertInto('grading_schemes').values({ team_id: team.teamId, version: 1000, rules: JSON.stringify({}), designated_grader_role: 'coordinator' }).execute();
  const [a, b] = [new pg.Client({ connectionString: tdb.url }), new pg.Client({ connectionString: tdb.url })];
  await Promise.all([a.connect(), b.connect()]);
  try {
    const insert = (client: pg.Client, grader: number) =>
      client.query(`INSERT INTO grades (snap_id, player_id, grader_id, scheme_version, assignment, result) VALUES ($1, $2, $3, 1, 'right', 'plus')`, [snapIds[0], team.playerIds[0], grader]);
    // The coach first, in a transaction left open; then the coordinator, whose ranking must wait
    // for the coach's to commit, and then sees both grades.
    await a.query('BEGIN');
    await insert(a, graders[1]!);
    await b.query('BEGIN');
    const coordinatorSave = insert(b, graders[0]!).then(() => b.query('COMMIT'));
    await new Promise((resolve) => setTimeout(resolve, 200));
    await a.query('COMMIT');
    await coordinatorSave;
  } finally {
    await Promise.all([a.end(), b.end()]);
  }
  const finals = await db.selectFrom('final_grades').select(['grader_id']).where('snap_id', '=', snapIds[0]!).where('player_id', '=', team.playerIds[0]!).execute();
  expect(finals).toEqual([{ grader_id: graders[0] }]);
  expect(await flaggedFinalIds()).toEqual(await oracleFinalIds());
});
