/// <reference lib="dom" />
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { startBrowserHarness, type BrowserHarness } from '../support/browser';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { makeClip } from '../support/media-fixtures';
import { createSession, waitForClips } from '../support/film';

/**
 * Monday in a real browser: a coach marks a moment of a clip for the guard; the player signs in on a
 * phone, finds it in his queue, plays from its marker under the seek bar, replies and says "Got it";
 * the coach sees the reply and the receipt on his own screen.
 */
let h: BrowserHarness;
let team: TeamFixture;
let dir: string;
let sessionId: number;
let clipId: number;

beforeAll(async () => {
  h = await startBrowserHarness();
  await h.t.startWorker();
  team = await createTeamFixture(h.t.ctx.db, 'Monday');
  const db = h.t.ctx.db;
  // The player account's lineman (LG) starts, so the desk puts him on the snap.
  await db.insertInto('depth_chart_entries').values({ season_id: team.seasonId, position: 'LG', rank: 1, player_id: team.ownPlayerId }).execute();
  dir = await mkdtemp(path.join(tmpdir(), 'tw-e2e-points-'));
  const analyst = h.t.client();
  await analyst.login(team.accounts.analyst.email, TEST_PASSWORD);
  sessionId = await createSession(analyst, team.teamId, { title: 'Week 11 vs Ashford Ridge', opponent: 'Ashford Ridge' });
  const file = await makeClip(dir, { seconds: 6, width: 480, height: 270, fps: 30, source: 'testsrc2', name: 'play-1.mp4' });
  const up = await analyst.upload(`/api/film-sessions/${sessionId}/clips`, [{ path: file }], { angle: 'sideline' });
  clipId = up.body.clips[0].id;
  await waitForClips(analyst, sessionId, { ids: [clipId], timeoutMs: 60_000 });
}, 120_000);

afterAll(async () => {
  await h?.close();
  if (dir) await rm(dir, { recursive: true, force: true });
});

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === '/');
}

test('a coaching point travels from the coach to the player and back', async () => {
  const coach = await h.newPage();
  await signIn(coach, team.accounts.coach.email);
  await coach.goto(`/film/${sessionId}/clips/${clipId}/points`);
  await coach.waitForFunction(() => {
    const v = document.querySelector('video');
    return v !== null && v.readyState >= 1 && v.duration > 5;
  }, null, { timeout: 20_000 });
  await coach.locator('video').first().evaluate((v: HTMLVideoElement) => {
    v.currentTime = 2.5;
  });
  await coach.waitForFunction(() => Math.abs((document.querySelector('video') as HTMLVideoElement).currentTime - 2.5) < 0.05);
  await coach.getByRole('button', { name: 'Start here', exact: true }).click();
  await coach.getByTestId('point-body').fill('Hands inside: thumbs up on the punch.');
  await coach.getByRole('button', { name: 'Add point' }).click();
  await coach.getByTestId('thread').filter({ hasText: 'Hands inside' }).waitFor();
  const stored = await h.t.ctx.db.selectFrom('clip_comments').innerJoin('comment_targets', 'comment_targets.comment_id', 'clip_comments.id').select(['clip_comments.at_ms', 'comment_targets.player_id']).where('clip_comments.clip_id', '=', clipId).execute();
  expect(stored).toHaveLength(1);
  expect(stored[0]!.player_id).toBe(team.ownPlayerId);
  expect(Math.abs(stored[0]!.at_ms - 2500)).toBeLessThanOrEqual(50);
  const pointAt = stored[0]!.at_ms / 1000;
  const { name: playerName } = await h.t.ctx.db.selectFrom('players').select('name').where('id', '=', team.ownPlayerId).executeTakeFirstOrThrow();
  const { name: playerAccountName } = await h.t.ctx.db.selectFrom('users').select('name').where('id', '=', team.accounts.player.userId).executeTakeFirstOrThrow();
  // Before the player has seen it: his name unticked, nobody has got it, no reply.
  const pointOnCoachScreen = coach.getByTestId('thread').filter({ hasText: 'Hands inside' });
  await pointOnCoachScreen.getByText('0 of 1 got it').waitFor();
  expect(await pointOnCoachScreen.locator('.target', { hasText: playerName }).textContent()).toContain(`${playerName}, not yet`);
  expect(await pointOnCoachScreen.locator('.replies li').count()).toBe(0);

  const player = await h.newPage({ width: 390, height: 844 });
  await signIn(player, team.accounts.player.email);
  await player.goto('/study');
  await player.getByTestId('study-clip').first().click();
  await player.waitForURL(/\/study\/clips\//);
  const thread = player.getByTestId('thread').filter({ hasText: 'Hands inside' });
  await thread.waitFor();
  await player.waitForFunction(() => (document.querySelector('video')?.readyState ?? 0) >= 1, null, { timeout: 20_000 });
  const video = player.locator('video').first();
  // Starting well away from the point's moment, so landing there can only come from the marker.
  expect(await video.evaluate((v: HTMLVideoElement) => v.currentTime)).toBeLessThan(pointAt - 1);
  const marker = player.getByRole('group', { name: 'Coaching points along the clip' }).getByRole('button', { name: /^Play from .*Hands inside/ });
  // The marker sits under the seek bar at the point's moment.
  const bar = await player.getByRole('slider', { name: 'Position in the video' }).boundingBox();
  const mark = await marker.boundingBox();
  const duration = await video.evaluate((v: HTMLVideoElement) => v.duration);
  const expectedX = bar!.x + (pointAt / duration) * bar!.width;
  const markerX = mark!.x + mark!.width / 2;
  expect(Math.abs(markerX - expectedX)).toBeLessThanOrEqual(12);
  // Where the first seek after the click lands, read at the moment it lands (playback moves on after).
  await video.evaluate((v: HTMLVideoElement) => {
    (window as unknown as { landed: Promise<number> }).landed = new Promise((resolve) => v.addEventListener('seeked', () => resolve(v.currentTime), { once: true }));
  });
  await marker.click();
  const landed = await player.evaluate(() => (window as unknown as { landed: Promise<number> }).landed);
  console.log(`Coaching point at ${pointAt} s: its seek-bar marker landed the video at ${landed.toFixed(3)} s (marker ${(markerX - expectedX).toFixed(1)} px from that moment of the bar).`);
  expect(Math.abs(landed - pointAt)).toBeLessThanOrEqual(0.3);
  await expect(marker.getAttribute('aria-current')).resolves.toBe('true');
  // It plays from there, not just jumps.
  await player.waitForFunction((from) => (document.querySelector('video') as HTMLVideoElement).currentTime > from + 0.2, landed, { timeout: 10_000 });
  await thread.getByRole('button', { name: 'Reply' }).click();
  await thread.getByLabel('Your reply').fill('Got it, coach: thumbs up.');
  await thread.getByRole('button', { name: /Send|Reply/ }).last().click();
  await thread.getByText('Got it, coach: thumbs up.').waitFor();
  await thread.getByRole('button', { name: 'Got it' }).click();
  await thread.getByText('You got it').waitFor();

  await coach.reload();
  const coachThread = coach.getByTestId('thread').filter({ hasText: 'Hands inside' });
  // The player's reply, under the point, signed as a player's.
  const reply = coachThread.locator('.replies li').filter({ hasText: 'Got it, coach: thumbs up.' });
  await reply.waitFor();
  expect((await reply.locator('.author').textContent())?.trim()).toBe(`${playerAccountName} (player)`);
  // The receipt: his name ticked and the tally moved from 0 to 1.
  await coachThread.getByText('1 of 1 got it').waitFor();
  const target = coachThread.locator('.target', { hasText: playerName });
  expect(await target.getAttribute('class')).toContain('got');
  expect(await target.textContent()).toContain(`${playerName}, got it`);
  const ack = await h.t.ctx.db.selectFrom('comment_targets').select('acknowledged_at').where('player_id', '=', team.ownPlayerId).executeTakeFirstOrThrow();
  expect(ack.acknowledged_at).not.toBeNull();
  await player.context().close();
  await coach.context().close();
}, 120_000);
