import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';
import type { ApiClient } from '../support/api-client';

/**
 * The unit grade is one rule on every screen (shared/stats unitSnapOutcome): the line dashboard and
 * the Grade Sheet agree on a hand-worked game, half-graded snaps wait instead of counting, practice
 * stays out of the game dashboard, and the weakest link is named.
 */
let t: TestApp;
let team: TeamFixture;
let coach: ApiClient;
let gameId: number;
let LT: number;
let LG: number;
let C: number;

const mark = (result: 'plus' | 'minus') =>
  result === 'plus'
    ? { assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', effort: 'plus' }
    : { assignment: 'right', footwork: 'plus', hands: 'minus', padLevel: 'plus', effort: 'plus' };

async function session(kind: 'game' | 'practice', title: string, date: string, snaps: number): Promise<{ id: number; snapIds: number[] }> {
  const created = await t.ctx.db.insertInto('film_sessions').values({ team_id: team.teamId, season_id: team.seasonId, kind, title, date }).returning('id').executeTakeFirstOrThrow();
  const snapIds: number[] = [];
  for (let order = 1; order <= snaps; order += 1) snapIds.push((await t.ctx.db.insertInto('snaps').values({ session_id: created.id, order }).returning('id').executeTakeFirstOrThrow()).id);
  return { id: created.id, snapIds };
}

async function grade(snapId: number, marks: [number, 'plus' | 'minus'][]): Promise<void> {
  for (const [player, result] of marks) expect((await coach.put(`/api/snaps/${snapId}/grades/${player}`, mark(result))).status).toBe(200);
}

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeamFixture(t.ctx.db, 'Unit');
  [LT, LG, C] = team.playerIds as [number, number, number];
  const coordinator = t.client();
  expect((await coordinator.login(team.accounts.coordinator.email, TEST_PASSWORD)).status).toBe(200);
  // No snap lists its linemen: the depth chart's three starters were on the field.
  expect((await coordinator.put(`/api/teams/${team.teamId}/depth-chart`, { positions: { LT: [LT], LG: [LG], C: [C] } })).status).toBe(200);
  coach = t.client();
  expect((await coach.login(team.accounts.coach.email, TEST_PASSWORD)).status).toBe(200);

  const game = await session('game', 'Week 3 vs Ferrow Glen', '2026-09-18', 4);
  gameId = game.id;
  const [s1, s2, s3, s4] = game.snapIds as [number, number, number, number];
  await grade(s1, [[LT, 'plus'], [LG, 'plus'], [C, 'plus']]); // all plus
  await grade(s2, [[LT, 'plus'], [LG, 'minus'], [C, 'plus']]); // not all plus; LG the weakest link
  await grade(s3, [[LT, 'plus'], [LG, 'plus']]); // C not graded yet: waits, counts in neither
  await grade(s4, [[LT, 'minus'], [LG, 'minus'], [C, 'plus']]); // not all plus; LT and LG both weakest
  // A practice rep where LT loses: the game dashboard leaves practice out.
  const practice = await session('practice', 'Week 3 practice', '2026-09-15', 1);
  await grade(practice.snapIds[0]!, [[LT, 'minus'], [LG, 'plus'], [C, 'plus']]);
}, 60_000);

afterAll(async () => {
  await t?.close();
});

test('line dashboard: 1 all-plus snap of 3 fully graded, 1 waiting; weakest link LG twice, LT once', async () => {
  const res = await coach.get(`/api/teams/${team.teamId}/line-dashboard`);
  expect(res.status).toBe(200);
  expect(res.body.games).toEqual([{ sessionId: gameId, title: 'Week 3 vs Ferrow Glen', date: '2026-09-18', snaps: 3, allPlus: 1, incomplete: 1, rate: 1 / 3 }]);
  expect(res.body.weakestLinks).toEqual([
    { playerId: LG, name: 'Brook Sandor', snaps: 2 },
    { playerId: LT, name: 'Avery Lintel', snaps: 1 },
  ]);
});

test('the Grade Sheet counts the same game the same way and names each snap weakest link', async () => {
  const res = await coach.get(`/api/film-sessions/${gameId}/grade-sheet`);
  expect(res.status).toBe(200);
  expect(res.body.unit).toMatchObject({ snaps: 3, allPlus: 1, incomplete: 1, rate: 1 / 3 });
  const bySnap = res.body.unit.bySnap.map((s: { order: number; onField: number; graded: number; counted: boolean; allPlus: boolean; weakestLinkIds: number[] }) => [
    s.order,
    s.onField,
    s.graded,
    s.counted,
    s.allPlus,
    [...s.weakestLinkIds].sort((a, b) => a - b),
  ]);
  expect(bySnap).toEqual([
    [1, 3, 3, true, true, []],
    [2, 3, 3, true, false, [LG]],
    [3, 3, 2, false, false, []],
    [4, 3, 3, true, false, [LT, LG].sort((a, b) => a - b)],
  ]);
});
