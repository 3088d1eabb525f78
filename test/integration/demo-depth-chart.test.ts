import { sql } from 'kysely';
import { DEMO_PASSWORD_FOR_TESTS, seedDemoTeam } from '../support/demo-team';
import { startTestApp, type TestApp } from '../support/test-app';
import type { ApiClient } from '../support/api-client';

/**
 * The demo's mid-season change: Eli Brannock (#64) starts at RG through week 3, Silas Wendroth (#68)
 * from week 4 (db/seeds/demo-roster.ts). The seeded film and grades must follow the chart of each
 * week, so every grade stands where its player lined up on that snap.
 */
let t: TestApp;
let teamId: number;
let coordinator: ApiClient;
const jersey = new Map<number, number>();

beforeAll(async () => {
  t = await startTestApp();
  teamId = await seedDemoTeam(t.ctx.db);
  for (const r of await t.ctx.db.selectFrom('roster_entries').select(['player_id', 'jersey']).execute()) jersey.set(r.player_id, r.jersey);
  coordinator = t.client();
  expect((await coordinator.login('coordinator@trenchwork.test', DEMO_PASSWORD_FOR_TESTS)).status).toBe(200);
}, 120_000);

afterAll(async () => {
  await t?.close();
});

const rgJerseys = (chart: { positions: Record<string, { jersey: number | null }[]> }) => chart.positions['RG']!.map((c) => c.jersey);

test('weeks 1–3 carry the base chart (#64 at RG); from week 4 #68 starts, and the history says who and why', async () => {
  const week3 = await coordinator.get(`/api/teams/${teamId}/depth-chart?week=3`);
  expect(week3.body).toMatchObject({ week: 3, inForceFromWeek: 0, savedWeeks: [0, 4], lastGameWeek: 6 });
  expect(rgJerseys(week3.body)).toEqual([64, 68, 65]);
  const week5 = await coordinator.get(`/api/teams/${teamId}/depth-chart?week=5`);
  expect(week5.body).toMatchObject({ inForceFromWeek: 4 });
  expect(rgJerseys(week5.body)).toEqual([68, 64, 65]);
  const history = await coordinator.get(`/api/teams/${teamId}/depth-chart/history`);
  expect(history.body.changes).toHaveLength(1);
  expect(history.body.changes[0]).toMatchObject({ week: 4, by: 'Mara Quillen', reason: expect.stringContaining('Wendroth') });
});

test("the week-5 game's desk puts #68 at RG where no substitution was recorded; week 2's puts #64", async () => {
  const gameOf = async (week: number) =>
    (await t.ctx.db.selectFrom('film_sessions').select('id').where('team_id', '=', teamId).where('kind', '=', 'game').where('week', '=', week).executeTakeFirstOrThrow()).id;
  for (const [week, rg] of [[2, 64], [5, 68]] as const) {
    const desk = await coordinator.get(`/api/film-sessions/${await gameOf(week)}/desk`);
    const fromChart = desk.body.snaps.filter((s: { participantsFromDepthChart: boolean }) => s.participantsFromDepthChart);
    expect(fromChart.length).toBeGreaterThan(20);
    for (const snap of fromChart) {
      const atRg = snap.participants.find((p: { position: string }) => p.position === 'RG');
      expect(jersey.get(atRg.playerId)).toBe(rg);
    }
  }
});

test('every seeded grade stands where its player lined up: the snap list, else the starters of that week', async () => {
  const { rows } = await sql<{ total: number; misplaced: number; coach_total: number; snaps: number }>`
    SELECT count(*)::int AS total,
           count(*) FILTER (WHERE g.position IS DISTINCT FROM coalesce(
             (SELECT sp.position FROM snap_participants sp WHERE sp.snap_id = g.snap_id AND sp.player_id = g.player_id),
             (SELECT d.position FROM depth_chart_entries d
              WHERE NOT EXISTS (SELECT 1 FROM snap_participants sp WHERE sp.snap_id = g.snap_id)
                AND d.season_id = fs.season_id AND d.player_id = g.player_id AND d.rank = 1 AND d.position <> 'TE'
                AND d.week = (SELECT max(w.week) FROM depth_chart_entries w WHERE w.season_id = fs.season_id AND w.week <= fs.week))
           ))::int AS misplaced,
           count(*) FILTER (WHERE u.email = 'coach@trenchwork.test')::int AS coach_total,
           (SELECT count(*)::int FROM snaps s2 JOIN film_sessions f2 ON f2.id = s2.session_id WHERE f2.team_id = ${teamId}) AS snaps
    FROM grades g JOIN snaps s ON s.id = g.snap_id JOIN film_sessions fs ON fs.id = s.session_id JOIN users u ON u.id = g.grader_id
    WHERE fs.team_id = ${teamId}`.execute(t.ctx.db);
  const totals = rows[0]!;
  expect(totals.total).toBeGreaterThan(0);
  expect(totals.misplaced).toBe(0);
  // The position coach grades the five linemen on the field on every snap.
  expect(totals.coach_total).toBe(5 * totals.snaps);
});
