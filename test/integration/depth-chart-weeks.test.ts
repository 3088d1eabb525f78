import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';
import type { ApiClient } from '../support/api-client';

/**
 * Depth charts by week, worked by hand. The base chart (week 0) lists LT, LG and C; the right guard
 * job stays open. From week 4 Quill starts at RG with Farrow behind him. So:
 *   - week 2 (and 3) show the week-0 chart, carried; week 4 and later show week 4's;
 *   - a week-3 game's desk has 3 linemen from the chart (6 cells on 2 snaps), a week-5 game's 4 (8);
 *   - Quill's grade on a week-3 snap stores no position, on a week-5 snap RG; Farrow (2nd) none;
 *   - a game without a week is graded against the current chart (week 4's).
 */
let t: TestApp;
let team: TeamFixture;
let coach: ApiClient;
let coordinator: ApiClient;
let LT: number;
let LG: number;
let C: number;
let QUILL: number;
let FARROW: number;
const game: Record<'week3' | 'week5' | 'noWeek', { id: number; snapIds: number[] }> = {} as never;

const allPlus = { assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', effort: 'plus' };
const chartUrl = () => `/api/teams/${team.teamId}/depth-chart`;
const idsOf = (list: { playerId: number }[]) => list.map((c) => c.playerId);

async function signedIn(email: string): Promise<ApiClient> {
  const client = t.client();
  expect((await client.login(email, TEST_PASSWORD)).status).toBe(200);
  return client;
}

async function rosterPlayer(name: string, jersey: number): Promise<number> {
  const player = await t.ctx.db.insertInto('players').values({ team_id: team.teamId, name }).returning('id').executeTakeFirstOrThrow();
  await t.ctx.db
    .insertInto('roster_entries')
    .values({ season_id: team.seasonId, player_id: player.id, jersey, positions: ['RG'], class_year: 'So', height_in: 75, weight_lb: 280 })
    .execute();
  return player.id;
}

async function gameOf(title: string, date: string, week: number | null): Promise<{ id: number; snapIds: number[] }> {
  const created = await t.ctx.db
    .insertInto('film_sessions')
    .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title, date, week })
    .returning('id')
    .executeTakeFirstOrThrow();
  const snapIds: number[] = [];
  for (let order = 1; order <= 2; order += 1) snapIds.push((await t.ctx.db.insertInto('snaps').values({ session_id: created.id, order }).returning('id').executeTakeFirstOrThrow()).id);
  return { id: created.id, snapIds };
}

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeamFixture(t.ctx.db, 'Weeks');
  [LT, LG, C] = team.playerIds as [number, number, number];
  QUILL = await rosterPlayer('Emmett Quill', 64);
  FARROW = await rosterPlayer('Dell Farrow', 68);
  coach = await signedIn(team.accounts.coach.email);
  coordinator = await signedIn(team.accounts.coordinator.email);
  game.week3 = await gameOf('Week 3 vs Hollow Creek', '2026-09-18', 3);
  game.week5 = await gameOf('Week 5 vs Quarry Point', '2026-10-02', 5);
  game.noWeek = await gameOf('Scrimmage vs Otter Bend', '2026-10-05', null);
}, 60_000);

afterAll(async () => {
  await t?.close();
});

describe('saving and reading charts by week', () => {
  test('a first save without a week makes the base chart (week 0), as before weeks existed', async () => {
    const base = await coordinator.put(chartUrl(), { positions: { LT: [LT], LG: [LG], C: [C] }, reason: 'camp chart' });
    expect(base.status).toBe(200);
    expect(base.body).toMatchObject({ week: 0, inForceFromWeek: 0, savedWeeks: [0], lastGameWeek: 5 });
    expect(idsOf(base.body.positions.C)).toEqual([C]);
    expect(base.body.positions.RG).toEqual([]);
  });

  test('saving week 4 gives it the carried chart with the positions sent replaced', async () => {
    const week4 = await coordinator.put(chartUrl(), { week: 4, positions: { RG: [QUILL, FARROW] }, reason: 'Quill won the job' });
    expect(week4.status).toBe(200);
    expect(week4.body).toMatchObject({ week: 4, inForceFromWeek: 4, savedWeeks: [0, 4] });
    expect(Object.fromEntries(Object.entries(week4.body.positions).map(([p, list]) => [p, idsOf(list as { playerId: number }[])]))).toEqual({
      LT: [LT],
      LG: [LG],
      C: [C],
      RG: [QUILL, FARROW],
      RT: [],
      TE: [],
    });
  });

  test('week 2 shows the week-0 chart carried forward; week 6 carries week 4; no week asked is the current one', async () => {
    const week2 = await coach.get(`${chartUrl()}?week=2`);
    expect(week2.status).toBe(200);
    expect(week2.body).toMatchObject({ week: 2, inForceFromWeek: 0, savedWeeks: [0, 4] });
    expect(week2.body.positions.RG).toEqual([]);
    expect(idsOf(week2.body.positions.LT)).toEqual([LT]);

    const week6 = await coach.get(`${chartUrl()}?week=6`);
    expect(week6.body).toMatchObject({ week: 6, inForceFromWeek: 4 });
    expect(idsOf(week6.body.positions.RG)).toEqual([QUILL, FARROW]);

    const current = await coach.get(chartUrl());
    expect(current.body).toMatchObject({ week: 4, inForceFromWeek: 4 });
    expect(current.body.updatedAt).toEqual(expect.any(String));

    expect((await coach.get(`${chartUrl()}?week=26`)).status).toBe(422);
    expect((await coach.get(`${chartUrl()}?week=-1`)).status).toBe(422);
  });

  test('the history records the week of each change and filters by week', async () => {
    const all = await coach.get(`${chartUrl()}/history`);
    expect(all.status).toBe(200);
    expect(all.body.changes.map((c: { week: number; reason: string }) => [c.week, c.reason])).toEqual([
      [4, 'Quill won the job'],
      [0, 'camp chart'],
    ]);
    // Week 4's first save started from the chart carried from week 0: nobody at RG before.
    const first = all.body.changes[0];
    expect(first.before.filter((e: { position: string }) => e.position === 'RG')).toEqual([]);
    expect(first.after.filter((e: { position: string }) => e.position === 'RG')).toEqual([
      { position: 'RG', rank: 1, playerId: QUILL },
      { position: 'RG', rank: 2, playerId: FARROW },
    ]);
    const week0 = await coach.get(`${chartUrl()}/history?week=0`);
    expect(week0.body.changes.map((c: { reason: string }) => c.reason)).toEqual(['camp chart']);
    const week3 = await coach.get(`${chartUrl()}/history?week=3`);
    expect(week3.body.changes).toEqual([]);
  });
});

describe('everything that reads starters uses the chart of the session week', () => {
  test("a week-3 game's desk shows the week-0 starters, a week-5 game's the week-4 ones, a game without a week the current ones", async () => {
    const participants = async (id: number) => (await coach.get(`/api/film-sessions/${id}/desk`)).body.snaps[0].participants;
    expect(await participants(game.week3.id)).toEqual([
      { playerId: LT, position: 'LT' },
      { playerId: LG, position: 'LG' },
      { playerId: C, position: 'C' },
    ]);
    const week4Starters = [
      { playerId: LT, position: 'LT' },
      { playerId: LG, position: 'LG' },
      { playerId: C, position: 'C' },
      { playerId: QUILL, position: 'RG' },
    ];
    expect(await participants(game.week5.id)).toEqual(week4Starters);
    expect(await participants(game.noWeek.id)).toEqual(week4Starters);
  });

  test('grading progress expects one cell per chart starter per snap: 3 × 2 in week 3, 4 × 2 in week 5', async () => {
    expect((await coach.get(`/api/film-sessions/${game.week3.id}/grading-progress`)).body.expectedCells).toBe(6);
    expect((await coach.get(`/api/film-sessions/${game.week5.id}/grading-progress`)).body.expectedCells).toBe(8);
  });

  test("a grade stores the position from the chart in force at the snap's week", async () => {
    const w3 = game.week3.snapIds[1]!;
    const w5 = game.week5.snapIds[0]!;
    for (const [snap, player] of [[w3, QUILL], [w3, LG], [w5, QUILL], [w5, FARROW]] as const) {
      expect((await coach.put(`/api/snaps/${snap}/grades/${player}`, allPlus)).status).toBe(200);
    }
    const stored = await t.ctx.db.selectFrom('grades').select(['snap_id', 'player_id', 'position']).where('snap_id', 'in', [w3, w5]).execute();
    const positionOf = (snap: number, player: number) => stored.find((g) => g.snap_id === snap && g.player_id === player)?.position;
    expect(positionOf(w3, QUILL)).toBeNull(); // week 0's chart had nobody at RG
    expect(positionOf(w3, LG)).toBe('LG');
    expect(positionOf(w5, QUILL)).toBe('RG');
    expect(positionOf(w5, FARROW)).toBeNull(); // second at RG: not a starter
  });

  test("the line dashboard counts each game's snaps against that week's starters", async () => {
    const [w3a] = game.week3.snapIds as [number];
    const [w5a, w5b] = game.week5.snapIds as [number, number];
    // Week 3, snap 1: the 3 chart starters all plus (against today's 4 starters it would wait).
    for (const player of [LT, LG, C]) expect((await coach.put(`/api/snaps/${w3a}/grades/${player}`, allPlus)).status).toBe(200);
    // Week 5, snap 1: Quill and Farrow graded above; LT, LG and C complete the 4 starters (Farrow is extra).
    for (const player of [LT, LG, C]) expect((await coach.put(`/api/snaps/${w5a}/grades/${player}`, allPlus)).status).toBe(200);
    // Week 5, snap 2: three of the four starters graded: it waits.
    for (const player of [LT, LG, C]) expect((await coach.put(`/api/snaps/${w5b}/grades/${player}`, allPlus)).status).toBe(200);
    const res = await coach.get(`/api/teams/${team.teamId}/line-dashboard`);
    expect(res.status).toBe(200);
    const byId = new Map(res.body.games.map((g: { sessionId: number }) => [g.sessionId, g]));
    // Week 3: snap 1 has 3 of 3 plus, counted; snap 2 (Quill and LG from above) has 2 of 3: waits.
    expect(byId.get(game.week3.id)).toMatchObject({ snaps: 1, allPlus: 1, incomplete: 1 });
    // Week 5: snap 1 has 5 graded ≥ 4 on the field, all plus; snap 2 has 3 of 4: waits.
    expect(byId.get(game.week5.id)).toMatchObject({ snaps: 1, allPlus: 1, incomplete: 1 });
  });
});

describe('saving a week between charts and the default week', () => {
  test('a save without a week goes to the current (latest) week; a save for week 2 leaves week 4 alone', async () => {
    const current = await coordinator.put(chartUrl(), { positions: { LT: [LT, FARROW] }, reason: 'Farrow as swing tackle' });
    expect(current.body).toMatchObject({ week: 4, inForceFromWeek: 4, savedWeeks: [0, 4] });
    expect(idsOf(current.body.positions.LT)).toEqual([LT, FARROW]);

    const week2 = await coordinator.put(chartUrl(), { week: 2, positions: { RG: [FARROW] }, reason: 'Farrow starts the second game' });
    expect(week2.body).toMatchObject({ week: 2, inForceFromWeek: 2, savedWeeks: [0, 2, 4] });
    expect(idsOf(week2.body.positions.RG)).toEqual([FARROW]);
    // Week 2 copied week 0 (LT alone), not week 4's swing tackle.
    expect(idsOf(week2.body.positions.LT)).toEqual([LT]);
    const week3 = await coach.get(`${chartUrl()}?week=3`);
    expect(week3.body).toMatchObject({ inForceFromWeek: 2 });
    const week5 = await coach.get(`${chartUrl()}?week=5`);
    expect(idsOf(week5.body.positions.RG)).toEqual([QUILL, FARROW]);
    // The week-3 game now lines up week 2's chart: Farrow at RG.
    const desk = await coach.get(`/api/film-sessions/${game.week3.id}/desk`);
    expect(desk.body.snaps[1].participants).toContainEqual({ playerId: FARROW, position: 'RG' });
    const week4History = await coach.get(`${chartUrl()}/history?week=4`);
    expect(week4History.body.changes.map((c: { reason: string }) => c.reason)).toEqual(['Farrow as swing tackle', 'Quill won the job']);
  });
});
