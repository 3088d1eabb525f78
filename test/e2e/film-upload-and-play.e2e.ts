/// <reference lib="dom" />
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { startBrowserHarness, type BrowserHarness } from '../support/browser';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { makeClip } from '../support/media-fixtures';

/**
 * Film in a real browser with the real worker: the analyst uploads two snaps from the sideline and
 * the same two from the end zone through the upload panel, the worker makes them ready, and a coach
 * plays snap 1 and switches angle at the same moment.
 */
let h: BrowserHarness;
let team: TeamFixture;
let dir: string;
let sessionId: number;

beforeAll(async () => {
  h = await startBrowserHarness();
  await h.t.startWorker();
  team = await createTeamFixture(h.t.ctx.db, 'Tape');
  dir = await mkdtemp(path.join(tmpdir(), 'tw-e2e-film-'));
  const session = await h.t.ctx.db
    .insertInto('film_sessions')
    .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 10 vs Cinder Valley', date: '2026-11-06', opponent: 'Cinder Valley' })
    .returning('id')
    .executeTakeFirstOrThrow();
  sessionId = session.id;
}, 60_000);

afterAll(async () => {
  await h?.close();
  if (dir) await rm(dir, { recursive: true, force: true });
});

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
}

async function clipsReady(count: number, timeoutMs = 90_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const rows = await h.t.ctx.db.selectFrom('clips').select('status').where('session_id', '=', sessionId).execute();
    if (rows.length >= count && rows.every((r) => r.status === 'ready')) return;
    if (rows.some((r) => r.status === 'failed')) throw new Error('a clip failed');
    if (Date.now() > deadline) throw new Error(`clips not ready: ${JSON.stringify(rows)}`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

test('the analyst uploads two angles; a coach plays snap 1 and switches angle at the same moment', async () => {
  const wide = [await makeClip(dir, { seconds: 3, width: 480, height: 270, fps: 30, source: 'testsrc2', name: 'wide-1.mp4' }), await makeClip(dir, { seconds: 3, width: 480, height: 270, fps: 30, source: 'mandelbrot', name: 'wide-2.mp4' })];
  const tight = [await makeClip(dir, { seconds: 3, width: 480, height: 270, fps: 30, source: 'smptebars', name: 'tight-1.mp4' }), await makeClip(dir, { seconds: 3, width: 480, height: 270, fps: 30, source: 'rgbtestsrc', name: 'tight-2.mp4' })];

  const analyst = await h.newPage();
  await signIn(analyst, team.accounts.analyst.email);
  await analyst.goto(`/film/${sessionId}`);
  await analyst.getByTestId('upload-files').setInputFiles(wide);
  await analyst.getByLabel('wide-2.mp4 sent').waitFor({ timeout: 30_000 });
  await analyst.getByRole('radio', { name: 'End zone' }).or(analyst.getByRole('button', { name: 'End zone' })).first().click();
  await analyst.getByTestId('upload-files').setInputFiles(tight);
  await analyst.getByLabel('tight-2.mp4 sent').waitFor({ timeout: 30_000 });
  await clipsReady(4);
  // The session page shows the new states by itself (it polls), with words, not only colour.
  await analyst.getByText('Ready').first().waitFor({ timeout: 15_000 });
  await analyst.context().close();

  const snaps = await h.t.ctx.db.selectFrom('snaps').select(['id', 'order']).where('session_id', '=', sessionId).orderBy('order').execute();
  expect(snaps.map((s) => s.order)).toEqual([1, 2]);
  const angles = await h.t.ctx.db.selectFrom('clips').select(['snap_id', 'angle']).where('session_id', '=', sessionId).execute();
  for (const snap of snaps) expect(angles.filter((a) => a.snap_id === snap.id).map((a) => a.angle).sort()).toEqual(['end_zone', 'sideline']);

  const coach = await h.newPage();
  await signIn(coach, team.accounts.coach.email);
  await coach.goto(`/film/${sessionId}`);
  const video = coach.locator('video').first();
  await video.waitFor();
  await coach.waitForFunction(() => {
    const v = document.querySelector('video');
    return v !== null && v.readyState >= 2 && v.duration > 2;
  }, null, { timeout: 20_000 });
  const firstSrc = await video.getAttribute('src');
  await video.evaluate((v: HTMLVideoElement) => {
    v.currentTime = 1.5;
  });
  await coach.waitForFunction(() => Math.abs((document.querySelector('video') as HTMLVideoElement).currentTime - 1.5) < 0.05);
  await coach.locator('tw-snap-player').focus().catch(() => undefined);
  await video.focus();
  await coach.keyboard.press('a');
  await coach.waitForFunction((before) => document.querySelector('video')?.getAttribute('src') !== before, firstSrc, { timeout: 10_000 });
  await coach.waitForFunction(() => {
    const v = document.querySelector('video') as HTMLVideoElement;
    return v.readyState >= 1 && Math.abs(v.currentTime - 1.5) < 0.1;
  }, null, { timeout: 10_000 });
  expect(await video.getAttribute('aria-label')).toMatch(/End zone|Sideline/);
  await coach.context().close();
}, 180_000);
