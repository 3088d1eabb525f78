import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { linkIn, listMail } from '../support/mailbox';
import { startTestApp, type TestApp } from '../support/test-app';
import { sendCoachingDigest } from '../../workers/coaching-digest.handler';
import { createMailer } from '../../workers/mailer';
import { createMediaOps } from '../../workers/media-toolkit';
import type { ApiClient } from '../support/api-client';

/**
 * The film room through the API: coaching points and what each player may see through every route,
 * threads, acknowledgements, watched coverage, cut-ups shared by name or group, the study report,
 * and mail: one digest for a batch of points, at most one an hour, preferences and unsubscribe.
 */
let t: TestApp;
let team: TeamFixture;
let other: TeamFixture;
let coach: ApiClient;
let player: ApiClient;
let stranger: ApiClient;
let sessionId: number;
let clips: number[];
let LT: number;
let LG: number;

async function signedIn(email: string): Promise<ApiClient> {
  const client = t.client();
  expect((await client.login(email, TEST_PASSWORD)).status).toBe(200);
  return client;
}

beforeAll(async () => {
  t = await startTestApp({ DIGEST_DELAY_SECONDS: '0' });
  await t.startWorker();
  team = await createTeamFixture(t.ctx.db, 'Room');
  other = await createTeamFixture(t.ctx.db, 'Elsewhere');
  [LT, LG] = team.playerIds as [number, number];
  coach = await signedIn(team.accounts.coach.email);
  player = await signedIn(team.accounts.player.email); // the player account is LG (team.ownPlayerId)
  stranger = await signedIn(other.accounts.coach.email);
  const session = await t.ctx.db
    .insertInto('film_sessions')
    .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 6 vs Granite Fork', date: '2026-10-09', opponent: 'Granite Fork' })
    .returning('id')
    .executeTakeFirstOrThrow();
  sessionId = session.id;
  clips = [];
  for (let order = 1; order <= 3; order += 1) {
    const snap = await t.ctx.db.insertInto('snaps').values({ session_id: sessionId, order }).returning('id').executeTakeFirstOrThrow();
    const clip = await t.ctx.db
      .insertInto('clips')
      .values({ team_id: team.teamId, session_id: sessionId, snap_id: snap.id, upload_order: order, original_name: `play${order}.mp4`, status: 'ready', duration_ms: 8000 })
      .returning('id')
      .executeTakeFirstOrThrow();
    clips.push(clip.id);
  }
}, 60_000);

afterAll(async () => {
  await t?.close();
});

const mailsTo = async (email: string, subject: RegExp) => (await listMail()).filter((m) => m.to.includes(email) && subject.test(m.subject));
async function eventually<T>(fn: () => Promise<T>, ok: (v: T) => boolean, ms = 15_000): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    const v = await fn();
    if (ok(v) || Date.now() > deadline) return v;
    await new Promise((r) => setTimeout(r, 200));
  }
}

describe('coaching points and visibility', () => {
  let pointForLG: number;
  let pointForLT: number;

  test('POST /api/clips/{id}/comments answers 201 with an id; players and analysts cannot post points', async () => {
    const res = await coach.post(`/api/clips/${clips[0]}/comments`, { playerIds: [LG], atMs: 1200, endMs: 2600, kind: 'correction', component: 'padLevel', body: 'Stay low out of your stance.' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ id: expect.any(Number), atMs: 1200, endMs: 2600, kind: 'correction', targets: [{ playerId: LG, acknowledged: false }] });
    pointForLG = res.body.id;
    const forLT = await coach.post(`/api/clips/${clips[1]}/comments`, { playerIds: [LT], atMs: 500, body: 'Great punch.' , kind: 'praise' });
    expect(forLT.status).toBe(201);
    pointForLT = forLT.body.id;
    expect((await player.post(`/api/clips/${clips[0]}/comments`, { playerIds: [LG], atMs: 0, body: 'x' })).status).toBe(403);
    const analyst = await signedIn(team.accounts.analyst.email);
    expect((await analyst.post(`/api/clips/${clips[0]}/comments`, { playerIds: [LG], atMs: 0, body: 'x' })).status).toBe(403);
  });

  test('GET /api/me/clips lists only what is tagged to the player, with the contract fields', async () => {
    const res = await player.get('/api/me/clips');
    expect(res.status).toBe(200);
    expect(res.body.clips).toHaveLength(1);
    expect(res.body.clips[0]).toMatchObject({ clipId: clips[0], sessionId, comments: [{ id: pointForLG, atMs: 1200, kind: 'correction', body: 'Stay low out of your stance.', acknowledged: false }] });
  });

  test('a clip not shared with the player does not exist for him through any route', async () => {
    for (const url of [`/api/clips/${clips[1]}`, `/api/clips/${clips[1]}/comments`, `/api/clips/${clips[1]}/poster`, `/api/clips/${clips[1]}/playback`, `/api/clips/${clips[1]}/strip`]) {
      expect([url, (await player.get(url)).status]).toEqual([url, 404]);
    }
    expect((await player.post(`/api/clips/${clips[1]}/questions`, { atMs: 10, body: 'What about this one?' })).status).toBe(404);
    expect((await player.post(`/api/clips/${clips[1]}/views`, { fromMs: 0, toMs: 1000 })).status).toBe(404);
    expect((await player.post(`/api/comments/${pointForLT}/replies`, { body: 'me too' })).status).toBe(404);
    expect((await player.post(`/api/comments/${pointForLT}/acknowledge`)).status).toBe(404);
    expect((await player.get(`/api/film-sessions/${sessionId}/clips`)).status).toBe(403);
    expect((await player.post('/api/cutups/preview', { teamId: team.teamId, filter: {} })).status).toBe(403);
  });

  test('coaches of another team see nothing of it', async () => {
    for (const url of [`/api/clips/${clips[0]}`, `/api/clips/${clips[0]}/comments`, `/api/film-sessions/${sessionId}/study-report`, `/api/teams/${team.teamId}/cutups`]) {
      expect([url, (await stranger.get(url)).status]).toEqual([url, 403]);
    }
    expect((await stranger.post(`/api/comments/${pointForLG}/replies`, { body: 'hi' })).status).toBe(403);
  });

  test('the player replies, asks, and acknowledges; the coach sees the reply and the receipt', async () => {
    const reply = await player.post(`/api/comments/${pointForLG}/replies`, { body: 'Is it my first step or my hips?' });
    expect(reply.status).toBe(201);
    const question = await player.post(`/api/clips/${clips[0]}/questions`, { atMs: 4000, body: 'Who had the backer here?' });
    expect(question.status).toBe(201);
    expect((await player.post(`/api/comments/${pointForLG}/acknowledge`)).status).toBe(204);
    const threads = (await coach.get(`/api/clips/${clips[0]}/comments`)).body.comments;
    const point = threads.find((c: { id: number }) => c.id === pointForLG);
    expect(point.targets).toEqual([{ playerId: LG, name: 'Brook Sandor', acknowledged: true }]);
    expect(point.replies.map((r: { body: string }) => r.body)).toEqual(['Is it my first step or my hips?']);
    expect(threads.find((c: { kind: string }) => c.kind === 'question').body).toBe('Who had the backer here?');
    const answer = await coach.post(`/api/comments/${question.body.id}/replies`, { body: 'The Mike: climb to him.' });
    expect(answer.status).toBe(201);
  });

  test('editing keeps history; deleting hides the comment but keeps the thread', async () => {
    const edited = await coach.patch(`/api/comments/${pointForLG}`, { body: 'Stay low out of your stance: eyes through the hip.' });
    expect(edited.body).toMatchObject({ edited: true, body: 'Stay low out of your stance: eyes through the hip.' });
    const history = await t.ctx.db.selectFrom('comment_revisions').select('body').where('comment_id', '=', pointForLG).execute();
    expect(history.map((h) => h.body)).toEqual(['Stay low out of your stance.']);
    expect((await player.patch(`/api/comments/${pointForLG}`, { body: 'mine now' })).status).toBe(403);
    expect((await coach.delete(`/api/comments/${pointForLG}`)).status).toBe(204);
    const threads = (await player.get(`/api/clips/${clips[0]}/comments`)).body.comments;
    const hidden = threads.find((c: { id: number }) => c.id === pointForLG);
    expect(hidden).toMatchObject({ hidden: true, body: '(removed)' });
    expect(hidden.replies).toHaveLength(1);
  });

  test('watched coverage: replays count once', async () => {
    await player.post(`/api/clips/${clips[0]}/views`, { fromMs: 0, toMs: 3000 });
    await player.post(`/api/clips/${clips[0]}/views`, { fromMs: 1000, toMs: 3000 });
    const res = await player.post(`/api/clips/${clips[0]}/views`, { fromMs: 6000, toMs: 8000 });
    // [0,3000] ∪ [6000,8000] = 5000 of 8000 ms.
    expect(res.body.watchedFraction).toBeCloseTo(5000 / 8000, 10);
  });
});

describe('cut-ups', () => {
  test('a cut-up shared with a position group reaches its players, and only its clips become visible', async () => {
    const made = await coach.post('/api/cutups', { teamId: team.teamId, title: 'Double teams vs 4i', clipIds: [clips[2], clips[1]] });
    expect(made.status).toBe(201);
    expect(made.body.items.map((i: { clipId: number }) => i.clipId)).toEqual([clips[2], clips[1]]);
    expect((await player.get(`/api/cutups/${made.body.id}`)).status).toBe(404);
    expect((await coach.put(`/api/cutups/${made.body.id}/shares`, { groups: ['LG'] })).status).toBe(200);
    const mine = await player.get('/api/me/cutups');
    expect(mine.body.cutups.map((c: { id: number }) => c.id)).toEqual([made.body.id]);
    expect((await player.get(`/api/cutups/${made.body.id}`)).status).toBe(200);
    expect((await player.get(`/api/clips/${clips[1]}`)).status).toBe(200);
    const reordered = await coach.patch(`/api/cutups/${made.body.id}`, { items: [{ clipId: clips[1], note: 'Watch the near hip.' }, { clipId: clips[2] }] });
    expect(reordered.body.items.map((i: { clipId: number; note: string | null }) => [i.clipId, i.note])).toEqual([[clips[1], 'Watch the near hip.'], [clips[2], null]]);
    // Sharing with the tight ends instead takes it away from the guard.
    await coach.put(`/api/cutups/${made.body.id}/shares`, { groups: ['TE'] });
    expect((await player.get(`/api/clips/${clips[1]}`)).status).toBe(404);
  });

  test('a filter picks the snaps of one player graded minus on a component', async () => {
    const snapOf = async (clipId: number) => (await t.ctx.db.selectFrom('clips').select('snap_id').where('id', '=', clipId).executeTakeFirstOrThrow()).snap_id!;
    const base = { assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', effort: 'plus' };
    await coach.put(`/api/snaps/${await snapOf(clips[0]!)}/grades/${LT}`, { ...base, padLevel: 'minus' });
    await coach.put(`/api/snaps/${await snapOf(clips[1]!)}/grades/${LT}`, base);
    await coach.put(`/api/snaps/${await snapOf(clips[2]!)}/grades/${LT}`, { ...base, padLevel: 'minus' });
    const res = await coach.post('/api/cutups/preview', { teamId: team.teamId, filter: { playerId: LT, component: 'padLevel', mark: 'minus' } });
    expect(res.status).toBe(200);
    expect(res.body.clips.map((c: { clipId: number }) => c.clipId)).toEqual([clips[0], clips[2]]);
  });
});

describe('study report and mail', () => {
  let rookieEmail = '';
  let rookieUserId = 0;
  test('the study report shows who watched and acknowledged, per position group', async () => {
    const res = await coach.get(`/api/film-sessions/${sessionId}/study-report?group=OL`);
    expect(res.status).toBe(200);
    const lg = res.body.players.find((p: { playerId: number }) => p.playerId === LG);
    // One point for LG (now hidden) → 0 counted; the player's own question is not a coaching point.
    expect(lg).toMatchObject({ points: 0, acknowledged: 0 });
    const lt = res.body.players.find((p: { playerId: number }) => p.playerId === LT);
    expect(lt).toMatchObject({ clips: 1, points: 1, acknowledged: 0, watched: 0 });
  });

  test('a batch of points arrives as one digest with links to the clips; the next batch waits for the hour', async () => {
    // A player with an account who has had no mail yet (the LG account got one with the first point).
    const rookie = await t.ctx.db.insertInto('players').values({ team_id: team.teamId, name: 'Dale Rookfield' }).returning('id').executeTakeFirstOrThrow();
    await t.ctx.db.insertInto('roster_entries').values({ season_id: team.seasonId, player_id: rookie.id, jersey: 67, positions: ['RG'], class_year: 'Fr' }).execute();
    const email = `rookie.${team.teamId}@room.test`;
    const user = await t.ctx.db.insertInto('users').values({ email, name: 'Dale Rookfield', password_hash: null }).returning('id').executeTakeFirstOrThrow();
    rookieEmail = email;
    rookieUserId = user.id;
    await t.ctx.db.insertInto('memberships').values({ user_id: user.id, team_id: team.teamId, role: 'player', player_id: rookie.id }).execute();
    const before = (await mailsTo(email, /coaching point/)).length;
    expect(before).toBe(0);
    // One request makes the three points at once, as a coach's session of tagging would within the delay.
    await t.ctx.db.transaction().execute(async (trx) => {
      for (const [i, clip] of clips.entries()) {
        const c = await trx.insertInto('clip_comments').values({ team_id: team.teamId, clip_id: clip, author_id: team.accounts.coach.userId, at_ms: 300 * (i + 1), kind: 'teaching', body: `Point ${i + 1}: hands inside.` }).returning('id').executeTakeFirstOrThrow();
        await trx.insertInto('comment_targets').values({ comment_id: c.id, player_id: rookie.id }).execute();
      }
    });
    expect((await coach.post(`/api/clips/${clips[0]}/comments`, { playerIds: [rookie.id], atMs: 100, kind: 'teaching', body: 'Point 0: feet first.' })).status).toBe(201);
    const after = await eventually(() => mailsTo(email, /coaching point/), (m) => m.length > before);
    expect(after.length).toBe(before + 1);
    const digest = after[0]!;
    expect(digest.subject).toMatch(/new coaching point/);
    expect(digest.text).toContain('Point 1: hands inside.');
    expect(digest.text).toContain('Point 3: hands inside.');
    expect(digest.html).toContain('Watch this clip');
    // Coaching points are technique coaching: the mail carries the safety caution too.
    expect(digest.html).toContain('athletic trainer and physicians decide');
    const link = linkIn(digest, '/study/clips/');
    expect(link).toMatch(new RegExp(`/study/clips/(${clips.join('|')})\\?at=\\d+`));
    // More points within the hour: no second mail now, a digest is waiting for later.
    await coach.post(`/api/clips/${clips[0]}/comments`, { playerIds: [rookie.id], atMs: 7000, body: 'One more thing.' });
    await new Promise((r) => setTimeout(r, 2500));
    expect((await mailsTo(email, /coaching point/)).length).toBe(before + 1);
    // The queue holds the next digest for the next hour slot; when it runs before a full hour has
    // passed since the last mail, the handler puts it back until the hour is up. Run it now to see that.
    const mailer = createMailer(t.config);
    await sendCoachingDigest({ config: t.config, logger: t.ctx.logger, db: t.ctx.db, storage: t.ctx.storage, jobs: t.jobs, mailer, media: createMediaOps(t.config) }, { playerId: rookie.id }, 'test');
    mailer.close();
    expect((await mailsTo(email, /coaching point/)).length).toBe(before + 1);
    const last = (await t.ctx.db.selectFrom('mail_preferences').select('last_digest_at').where('user_id', '=', rookieUserId).executeTakeFirstOrThrow()).last_digest_at!;
    const waiting = await t.ctx.db
      .selectFrom('pgboss.job' as never)
      .select(['start_after' as never])
      .where('name' as never, '=', 'digest.coaching' as never)
      .where('state' as never, 'in', ['created', 'retry'] as never)
      .execute();
    const latest = Math.max(...(waiting as { start_after: Date }[]).map((j) => new Date(j.start_after).getTime()));
    expect(latest - last.getTime()).toBeGreaterThanOrEqual(3600_000 - 2000);
  });

  test('preferences: the digest can be turned off; the unsubscribe link works without signing in', async () => {
    const prefs = await player.get('/api/me/mail-preferences');
    expect(prefs.body).toEqual({ coachingDigest: true, digestEveryHours: 1, weeklySummary: true });
    const saved = await player.put('/api/me/mail-preferences', { coachingDigest: true, digestEveryHours: 3, weeklySummary: true });
    expect(saved.body.digestEveryHours).toBe(3);
    const digest = (await mailsTo(rookieEmail, /coaching point/))[0]!;
    expect(digest).toBeDefined();
    const link = new URL(linkIn(digest, '/mail/unsubscribe'));
    const anonymous = t.client();
    const res = await anonymous.post('/api/mail/unsubscribe', { token: link.searchParams.get('token') });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ list: 'digest' });
    const stored = await t.ctx.db.selectFrom('mail_preferences').select(['coaching_digest', 'weekly_summary']).where('user_id', '=', rookieUserId).executeTakeFirstOrThrow();
    expect(stored).toEqual({ coaching_digest: false, weekly_summary: true });
    const forged = await anonymous.post('/api/mail/unsubscribe', { token: `${team.accounts.coach.userId}.digest.AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA` });
    expect(forged.status).toBe(400);
  });

  test('the weekly summary goes to players who want it, with text and HTML parts and an unsubscribe link', async () => {
    // One graded snap for the player's account (LG), so his summary has a rate to show.
    const snap = (await t.ctx.db.selectFrom('clips').select('snap_id').where('id', '=', clips[0]!).executeTakeFirstOrThrow()).snap_id!;
    await coach.put(`/api/snaps/${snap}/grades/${LG}`, { assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', effort: 'plus' });
    const coordinator = await signedIn(team.accounts.coordinator.email);
    expect((await coordinator.post(`/api/teams/${team.teamId}/weekly-summaries`)).status).toBe(202);
    const mails = await eventually(() => mailsTo(team.accounts.player.email, /week on film/), (m) => m.length > 0);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toContain('Plus rate, newest first');
    expect(mails[0]!.text).toMatch(/Week 6 vs Granite Fork: 100 % of 1 snaps/);
    expect(mails[0]!.html).toContain('Stop these weekly mails');
    expect(mails[0]!.html).toContain('athletic trainer and physicians decide');
    expect(linkIn(mails[0]!, '/mail/unsubscribe')).toContain('token=');
  });
});
