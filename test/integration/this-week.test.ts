import { createTeamFixture, TEST_PASSWORD } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/** The staff home page: next game, grading progress of the last one, who has not caught up. */
let t: TestApp;
afterAll(async () => {
  await t?.close();
});

test('next game, grading share of the last game, and players behind on their points', async () => {
  t = await startTestApp();
  const team = await createTeamFixture(t.ctx.db, 'Week');
  const db = t.ctx.db;
  const [lt, lg] = team.playerIds as [number, number];
  await db.insertInto('depth_chart_entries').values([{ season_id: team.seasonId, position: 'LT', rank: 1, player_id: lt }, { season_id: team.seasonId, position: 'LG', rank: 1, player_id: lg }]).execute();
  const today = new Date();
  const day = (offset: number) => new Date(today.getTime() + offset * 86_400_000).toISOString().slice(0, 10);
  const last = await db.insertInto('film_sessions').values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 8', date: day(-2), opponent: 'Pell Harbor' }).returning('id').executeTakeFirstOrThrow();
  await db.insertInto('film_sessions').values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 9', date: day(5), opponent: 'Wrenfield', week: 9 }).execute();
  const snap = await db.insertInto('snaps').values({ session_id: last.id, order: 1 }).returning('id').executeTakeFirstOrThrow();
  await db.insertInto('snaps').values({ session_id: last.id, order: 2 }).execute();
  const clip = await db.insertInto('clips').values({ team_id: team.teamId, session_id: last.id, snap_id: snap.id, upload_order: 1, original_name: 'a.mp4', status: 'ready', duration_ms: 5000 }).returning('id').executeTakeFirstOrThrow();
  const coach = t.client();
  await coach.login(team.accounts.coach.email, TEST_PASSWORD);
  await coach.put(`/api/snaps/${snap.id}/grades/${lt}`, { assignment: 'right', footwork: 'plus' });
  await coach.post(`/api/clips/${clip.id}/comments`, { playerIds: [lg], atMs: 100, body: 'Eyes up.' });
  const res = await coach.get(`/api/teams/${team.teamId}/this-week`);
  expect(res.status).toBe(200);
  expect(res.body.nextGame).toMatchObject({ opponent: 'Wrenfield', week: 9 });
  // Two snaps × two starters = 4 expected grades; 1 graded.
  expect(res.body.lastGame).toMatchObject({ sessionId: last.id, expectedCells: 4, finalCells: 1, locked: false });
  expect(res.body.study.notCaughtUp).toEqual([expect.objectContaining({ playerId: lg, points: 1, acknowledged: 0 })]);
  const player = t.client();
  await player.login(team.accounts.player.email, TEST_PASSWORD);
  expect((await player.get(`/api/teams/${team.teamId}/this-week`)).status).toBe(403);
});
