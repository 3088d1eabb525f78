import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { createSession, waitForClips } from '../support/film';
import { makeClip } from '../support/media-fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * A worker process killed with SIGKILL in the middle of a clip: once its lease runs out another
 * worker takes the job, and the clip ends ready exactly once, with one copy of each output.
 */
const MEDIA_TIMEOUT_SECONDS = 4; // lease = 7 × 4 + 4 = 32 s (server/core/jobs.ts)
let t: TestApp;
let team: TeamFixture;
let dir: string;
const workers: ChildProcess[] = [];

function startWorkerProcess(): ChildProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', 'workers/main.ts'], {
    cwd: path.resolve(__dirname, '../..'),
    env: {
      ...process.env,
      NODE_ENV: 'test',
      LOG_LEVEL: 'silent',
      DATABASE_URL: t.database.url,
      S3_BUCKET: t.config.s3.bucket,
      SESSION_SECRET: t.config.sessionSecret,
      MEDIA_TIMEOUT_SECONDS: String(MEDIA_TIMEOUT_SECONDS),
      JOB_MAINTENANCE_SECONDS: '1',
      WORKER_CONCURRENCY: '1',
    },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  workers.push(child);
  return child;
}

beforeAll(async () => {
  t = await startTestApp({ MEDIA_TIMEOUT_SECONDS: String(MEDIA_TIMEOUT_SECONDS) });
  team = await createTeamFixture(t.ctx.db, 'Crash');
  dir = await mkdtemp(path.join(tmpdir(), 'tw-crash-'));
}, 60_000);

afterAll(async () => {
  for (const w of workers) if (w.exitCode === null) w.kill('SIGKILL');
  await t?.close();
  if (dir) await rm(dir, { recursive: true, force: true });
});

test('kill -9 mid-job: after restart the clip ends ready once, with one rendition object', async () => {
  const analyst = t.client();
  expect((await analyst.login(team.accounts.analyst.email, TEST_PASSWORD)).status).toBe(200);
  const sessionId = await createSession(analyst, team.teamId);
  // MPEG-4 Part 2 video must be transcoded, so the job has a long last step to be killed in.
  const file = await makeClip(dir, { seconds: 6, width: 640, height: 360, fps: 30, videoCodec: 'mpeg4', audio: true, source: 'mandelbrot', name: 'needs-transcode.mp4' });
  const up = await analyst.upload(`/api/film-sessions/${sessionId}/clips`, [{ path: file }], { angle: 'sideline' });
  expect(up.status).toBe(201);
  const clipId = up.body.clips[0].id as number;

  const first = startWorkerProcess();
  const deadline = Date.now() + 30_000;
  let progress = 0;
  while (Date.now() < deadline) {
    const row = await t.ctx.db.selectFrom('clips').select(['status', 'progress']).where('id', '=', clipId).executeTakeFirstOrThrow();
    progress = row.progress;
    if (row.status === 'processing' && row.progress >= 60) break;
    await new Promise((r) => setTimeout(r, 50));
  }
  expect(progress).toBeGreaterThanOrEqual(60);
  first.kill('SIGKILL');
  await new Promise((resolve) => first.once('exit', resolve));
  const stuck = await t.ctx.db.selectFrom('clips').select('status').where('id', '=', clipId).executeTakeFirstOrThrow();
  expect(stuck.status).toBe('processing');

  startWorkerProcess();
  const [done] = await waitForClips(analyst, sessionId, { ids: [clipId], timeoutMs: 90_000 });
  expect([done!.status, done!.failureReason]).toEqual(['ready', null]);

  const folder = await t.ctx.storage.list(`teams/${team.teamId}/clips/${clipId}/`);
  expect(folder.sort()).toEqual([`teams/${team.teamId}/clips/${clipId}/poster.jpg`, `teams/${team.teamId}/clips/${clipId}/strip.jpg`, `teams/${team.teamId}/clips/${clipId}/web.mp4`]);
  const completed = await t.ctx.db
    .selectFrom('pgboss.job' as never)
    .select(['state' as never])
    .where('name' as never, '=', 'clip.process' as never)
    .execute();
  expect((completed as { state: string }[]).filter((j) => j.state === 'completed')).toHaveLength(1);
}, 150_000);
