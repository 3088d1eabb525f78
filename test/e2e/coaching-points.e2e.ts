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
 * phone, finds it in his queue, plays from the marker, replies and says "Got it"; the coach sees the
 * reply and the receipt.
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

  const player = await h.newPage({ width: 390, height: 844 });
  await signIn(player, team.accounts.player.email);
  await player.goto('/study');
  await player.getByTestId('study-clip').first().click();
  await player.waitForURL(/\/study\/clips\//);
  const thread = player.getByTestId('thread').filter({ hasText: 'Hands inside' });
  await thread.waitFor();
  await player.waitForFunction(() => (document.querySelector('video')?.readyState ?? 0) >= 1, null, { timeout: 20_000 });
  await thread.getByRole('button', { name: /^Play from/ }).click();
  await player.waitForFunction(() => Math.abs((document.querySelector('video') as HTMLVideoElement).currentTime - 2.5) < 0.15, null, { timeout: 10_000 });
  await thread.getByRole('button', { name: 'Reply' }).click();
  await thread.getByLabel('Your reply').fill('Got it, coach: thumbs up.');
  await thread.getByRole('button', { name: /Send|Reply/ }).last().click();
  await thread.getByText('Got it, coach: thumbs up.').waitFor();
  await thread.getByRole('button', { name: 'Got it' }).click();
  await thread.getByText('You got it').waitFor();

  await coach.reload();
  const coachThread = coach.getByTestId('thread').filter({ hasText: 'Hands inside' });
  await coachThread.getByText('Got it, coach: thumbs up.').waitFor();
  const ack = await h.t.ctx.db.selectFrom('comment_targets').select('acknowledged_at').where('player_id', '=', team.ownPlayerId).executeTakeFirstOrThrow();
  expect(ack.acknowledged_at).not.toBeNull();
  await player.context().close();
  await coach.context().close();
}, 120_000);
