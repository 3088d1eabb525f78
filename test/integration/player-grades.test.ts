import { DEFAULT_MISSED_REASONS, DEFAULT_PENALTY_TYPES } from '@shared/grading';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { linkIn, waitForMail } from '../support/mailbox';
import { startTestApp, type TestApp } from '../support/test-app';
import type { ApiClient } from '../support/api-client';

/**
 * What a player sees of his own grades: his final grade on each clip of his Study Queue and his row
 * of a session's Grade Sheet, only while the staff shares grades; never another player's numbers;
 * the sharing switches themselves; and the mailed sheet's link to his page.
 */
let t: TestApp;
let team: TeamFixture;
let other: TeamFixture;
let coach: ApiClient;
let coordinator: ApiClient;
let player: ApiClient;
let stranger: ApiClient;
let sessionId: number;
let quietSessionId: number;
let snaps: number[];
let clips: number[];
let LT: number;
let LG: number;

async function signedIn(email: string): Promise<ApiClient> {
  const client = t.client();
  expect((await client.login(email, TEST_PASSWORD)).status).toBe(200);
  return client;
}

const allPlus = { assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', effort: 'plus' };
const sheetOf = (client: ApiClient, session: number, playerId: number) => client.get(`/api/film-sessions/${session}/grade-sheet/players/${playerId}`);
const share = async (change: { gradesWithPlayers?: boolean; unitWithPlayers?: boolean }) => {
  const res = await coordinator.patch(`/api/teams/${team.teamId}/sharing`, change);
  expect(res.status).toBe(200);
  return res.body as { gradesWithPlayers: boolean; unitWithPlayers: boolean };
};

beforeAll(async () => {
  t = await startTestApp();
  await t.startWorker();
  team = await createTeamFixture(t.ctx.db, 'Shared');
  other = await createTeamFixture(t.ctx.db, 'Yonder');
  [LT, LG] = team.playerIds as [number, number];
  coach = await signedIn(team.accounts.coach.email);
  coordinator = await signedIn(team.accounts.coordinator.email);
  player = await signedIn(team.accounts.player.email); // LG (team.ownPlayerId)
  stranger = await signedIn(other.accounts.coach.email);

  const scheme = await coordinator.put(`/api/teams/${team.teamId}/grading-scheme`, {
    extraComponents: [{ key: 'finish', label: 'Finish', active: true }],
    missedReasons: DEFAULT_MISSED_REASONS,
    penaltyTypes: DEFAULT_PENALTY_TYPES,
    resultRule: { kind: 'strict' },
    winningThreshold: 0.8,
    designatedGraderRole: 'coordinator',
  });
  expect(scheme.status).toBe(200);

  const db = t.ctx.db;
  sessionId = (await db.insertInto('film_sessions').values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 3 vs Slate Hollow', date: '2026-09-18', opponent: 'Slate Hollow' }).returning('id').executeTakeFirstOrThrow()).id;
  quietSessionId = (await db.insertInto('film_sessions').values({ team_id: team.teamId, season_id: team.seasonId, kind: 'practice', title: 'Tuesday team period', date: '2026-09-22' }).returning('id').executeTakeFirstOrThrow()).id;
  snaps = [];
  clips = [];
  for (let order = 1; order <= 4; order += 1) {
    const snap = await db.insertInto('snaps').values({ session_id: sessionId, order }).returning('id').executeTakeFirstOrThrow();
    const clip = await db
      .insertInto('clips')
      .values({ team_id: team.teamId, session_id: sessionId, snap_id: snap.id, upload_order: order, original_name: `play${order}.mp4`, status: 'ready', duration_ms: 8000 })
      .returning('id')
      .executeTakeFirstOrThrow();
    snaps.push(snap.id);
    clips.push(clip.id);
  }
  // His queue: clips 1, 2 and 4 carry points for him; clip 3 is LT's only.
  for (const [clip, playerIds] of [[clips[0], [LG]], [clips[1], [LG]], [clips[2], [LT]], [clips[3], [LG]]] as const) {
    expect((await coach.post(`/api/clips/${clip}/comments`, { playerIds, atMs: 900, kind: 'correction', component: 'footwork', body: 'Six-inch first step.' })).status).toBe(201);
  }
  const put = (client: ApiClient, snap: number, playerId: number, body: object) => client.put(`/api/snaps/${snap}/grades/${playerId}`, body);
  // Two graders on LG's snaps 1 and 2: the coordinator holds the designated role, so his grade (all
  // plus) is the final one whether he graded later (snap 1) or first (snap 2); the coach's minus is not.
  expect((await put(coach, snaps[0]!, LG, { ...allPlus, hands: 'minus' })).status).toBe(200);
  expect((await put(coordinator, snaps[0]!, LG, { ...allPlus, extra: { finish: 'plus' } })).status).toBe(200);
  expect((await put(coordinator, snaps[1]!, LG, allPlus)).status).toBe(200);
  expect((await put(coach, snaps[1]!, LG, { ...allPlus, footwork: 'minus' })).status).toBe(200);
  // Snap 3, LG: a missed assignment (minus); snap 4 not graded. LT's grades must never reach him.
  expect((await put(coach, snaps[2]!, LG, { ...allPlus, assignment: 'missed', missedReason: 'wrong call', effort: 'loaf' })).status).toBe(200);
  expect((await put(coach, snaps[0]!, LT, allPlus)).status).toBe(200);
  expect((await put(coach, snaps[1]!, LT, { ...allPlus, footwork: 'minus' })).status).toBe(200);
}, 60_000);

afterAll(async () => {
  await t?.close();
});

describe('his grades in the Study Queue', () => {
  test('with sharing on (the default), each clip carries his final grade from the final-grade rule; the contract fields stay', async () => {
    const res = await player.get('/api/me/clips');
    expect(res.status).toBe(200);
    expect(res.body.gradesShared).toBe(true);
    const byClip = new Map(res.body.clips.map((c: { clipId: number }) => [c.clipId, c]));
    expect([...byClip.keys()].sort()).toEqual([clips[0], clips[1], clips[3]].sort());
    const first = byClip.get(clips[0]!) as Record<string, unknown>;
    expect(first).toMatchObject({ clipId: clips[0], sessionId, comments: [{ id: expect.any(Number), atMs: 900, kind: 'correction', body: 'Six-inch first step.', acknowledged: false }] });
    // The coordinator's grade (plus), not the coach's earlier minus.
    expect(first.grade).toEqual({
      result: 'plus',
      marks: [
        { key: 'assignment', label: 'Assignment', mark: 'right' },
        { key: 'footwork', label: 'Footwork', mark: 'plus' },
        { key: 'hands', label: 'Hands', mark: 'plus' },
        { key: 'padLevel', label: 'Pad level', mark: 'plus' },
        { key: 'finish', label: 'Finish', mark: 'plus' },
        { key: 'effort', label: 'Effort', mark: 'plus' },
      ],
    });
    expect((byClip.get(clips[1]!) as Record<string, unknown>).grade).toMatchObject({ result: 'plus', marks: expect.arrayContaining([{ key: 'footwork', label: 'Footwork', mark: 'plus' }]) });
    expect((byClip.get(clips[3]!) as Record<string, unknown>).grade).toBeNull();
  });

  test('with sharing off, the queue keeps its clips and points but carries no grade', async () => {
    await share({ gradesWithPlayers: false });
    try {
      const res = await player.get('/api/me/clips');
      expect(res.status).toBe(200);
      expect(res.body.gradesShared).toBe(false);
      expect(res.body.clips).toHaveLength(3);
      for (const clip of res.body.clips) {
        expect(clip).toMatchObject({ clipId: expect.any(Number), sessionId, comments: [expect.objectContaining({ id: expect.any(Number), atMs: 900, kind: 'correction', body: 'Six-inch first step.', acknowledged: false })] });
        expect(clip.grade).toBeNull();
      }
    } finally {
      await share({ gradesWithPlayers: true });
    }
  });
});

describe("a player's own Grade Sheet", () => {
  test('he reads his own row from the final grades, with the names of the team\'s own parts', async () => {
    const res = await sheetOf(player, sessionId, LG);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ sessionId, sessionTitle: 'Week 3 vs Slate Hollow', sessionDate: '2026-09-18', winningThreshold: 0.8, extraLabels: { finish: 'Finish' } });
    // Snaps 1 and 2 plus (the coordinator's), snap 3 minus: 2 of 3.
    expect(res.body.player).toMatchObject({ playerId: LG, name: 'Brook Sandor', snaps: 3, plus: 2, meetsWinningGrade: false, missedAssignments: 1, missedByReason: { 'wrong call': 1 } });
    expect(res.body.player.plusRate).toBeCloseTo(2 / 3);
    expect(res.body.player.components.hands).toEqual({ plus: 3, minus: 0, rate: 1 });
    expect(res.body.player.components.footwork).toEqual({ plus: 3, minus: 0, rate: 1 });
    expect(JSON.stringify(res.body)).not.toContain('Avery Lintel');
  });

  test('a session without a final grade of his answers with no row', async () => {
    const res = await sheetOf(player, quietSessionId, LG);
    expect(res.status).toBe(200);
    expect(res.body.player).toBeNull();
  });

  test("another player's sheet is refused to him, with a JSON error", async () => {
    const res = await sheetOf(player, sessionId, LT);
    expect(res.status).toBe(403);
    expect(res.body.error).toMatchObject({ code: 'forbidden', message: expect.stringMatching(/your own/) });
  });

  test('with sharing off he gets nothing, with a clear JSON error', async () => {
    await share({ gradesWithPlayers: false });
    try {
      const res = await sheetOf(player, sessionId, LG);
      expect(res.status).toBe(403);
      expect(res.body.error).toMatchObject({ code: 'forbidden', message: expect.stringMatching(/not shared grades/) });
      expect(res.body).not.toHaveProperty('player');
    } finally {
      await share({ gradesWithPlayers: true });
    }
  });

  test("staff read any player's row of their team; a coach of another team is refused; a stranger's player is not found", async () => {
    const lt = await sheetOf(coach, sessionId, LT);
    expect(lt.status).toBe(200);
    expect(lt.body.player).toMatchObject({ playerId: LT, snaps: 2, plus: 1 });
    const refused = await sheetOf(stranger, sessionId, LG);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('forbidden');
    expect((await sheetOf(coach, sessionId, other.playerIds[0]!)).status).toBe(404);
  });

  test("the mailed sheet links to the player's own sheet of that session", async () => {
    expect((await coach.post(`/api/film-sessions/${sessionId}/grade-sheet/mail`, { playerId: LG })).status).toBe(202);
    const mail = await waitForMail(team.accounts.player.email, /grade sheet/);
    expect(linkIn(mail, '/study/sheets/')).toBe(`${t.ctx.config.publicUrl}/study/sheets/${sessionId}`);
  });
});

describe('the sharing switches', () => {
  test('only admins and coordinators of the team change them; the team document shows them', async () => {
    expect((await coach.patch(`/api/teams/${team.teamId}/sharing`, { unitWithPlayers: true })).status).toBe(403);
    expect((await stranger.patch(`/api/teams/${team.teamId}/sharing`, { unitWithPlayers: true })).status).toBe(403);
    expect((await coordinator.patch(`/api/teams/${team.teamId}/sharing`, { unitWithPlayers: 'yes' })).status).toBe(422);
    expect((await player.get(`/api/teams/${team.teamId}`)).body.sharing).toEqual({ gradesWithPlayers: true, unitWithPlayers: false });
  });

  test('unit sharing opens the Readiness Grid to players, read only', async () => {
    expect((await player.get(`/api/teams/${team.teamId}/readiness`)).status).toBe(403);
    expect(await share({ unitWithPlayers: true })).toEqual({ gradesWithPlayers: true, unitWithPlayers: true });
    try {
      expect((await player.get(`/api/teams/${team.teamId}`)).body.sharing.unitWithPlayers).toBe(true);
      expect((await player.get(`/api/teams/${team.teamId}/readiness`)).status).toBe(200);
      expect((await player.get(`/api/teams/${team.teamId}/line-dashboard`)).status).toBe(200);
      // Turning one switch leaves the other alone.
      expect(await share({ gradesWithPlayers: false })).toEqual({ gradesWithPlayers: false, unitWithPlayers: true });
    } finally {
      expect(await share({ gradesWithPlayers: true, unitWithPlayers: false })).toEqual({ gradesWithPlayers: true, unitWithPlayers: false });
    }
    expect((await player.get(`/api/teams/${team.teamId}/readiness`)).status).toBe(403);
  });
});
