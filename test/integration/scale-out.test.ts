import { randomBytes } from 'node:crypto';
import { mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import path from 'node:path';
import { ManagedChild } from '../../scripts/stack/managed-child';
import { freePorts } from '../../scripts/stack/ports';
import { waitForHttpOk } from '../../scripts/stack/wait-for-http';
import { loadConfig } from '../../server/core/config';
import { createObjectStorage, type ObjectStorage } from '../../server/core/storage';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { listMail } from '../support/mailbox';
import { makeClip, type LavfiSource } from '../support/media-fixtures';
import { testServices } from '../support/services';
import { createTestDatabase, type TestDatabase } from '../support/test-database';

/**
 * The production shape on one machine: two API processes and three worker processes, all real
 * (`node --import tsx server/main.ts` / `workers/main.ts`), sharing one database, one bucket and
 * one SESSION_SECRET. A session made on one API works on the other, CSRF tokens too, and every job
 * enqueued runs exactly once although three workers poll the same queues.
 */
const ROOT = path.resolve(__dirname, '../..');
const CLIPS = 6;
const MAILS = 6;
const WORKERS = 3;

let database: TestDatabase;
let storage: ObjectStorage;
let team: TeamFixture;
let workDir: string;
let apis: string[] = [];
const children: ManagedChild[] = [];
const workerLogs: string[] = [];
const tag = randomBytes(4).toString('hex');

/** A browser's cookie jar for one host: cookies are not kept apart by port, so both APIs see them. */
class CookieJar {
  private readonly cookies = new Map<string, string>();

  get(name: string): string | undefined {
    return this.cookies.get(name);
  }

  async fetch(base: string, method: string, route: string, body?: unknown, headers: Record<string, string> = {}): Promise<{ status: number; body: any }> {
    const isForm = body instanceof FormData;
    const response = await fetch(`${base}${route}`, {
      method,
      headers: {
        cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '),
        ...(body !== undefined && !isForm ? { 'content-type': 'application/json' } : {}),
        ...(method !== 'GET' ? { 'x-xsrf-token': decodeURIComponent(this.cookies.get('XSRF-TOKEN') ?? '') } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
      redirect: 'manual',
    });
    for (const cookie of response.headers.getSetCookie()) {
      const [pair] = cookie.split(';');
      const at = pair!.indexOf('=');
      this.cookies.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
    const text = await response.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : undefined;
    } catch {
      // Not JSON: keep the text.
    }
    return { status: response.status, body: parsed };
  }
}

async function signIn(base: string, email: string): Promise<CookieJar> {
  const jar = new CookieJar();
  await jar.fetch(base, 'GET', '/api/health');
  const res = await jar.fetch(base, 'POST', '/api/auth/login', { email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  return jar;
}

function start(name: string, entry: string, env: NodeJS.ProcessEnv): ManagedChild {
  const log = path.join(workDir, `${name}.log`);
  const child = new ManagedChild({ name, command: process.execPath, args: ['--import', 'tsx', entry], cwd: ROOT, env, output: { file: log } });
  children.push(child);
  if (name.startsWith('worker')) workerLogs.push(log);
  return child;
}

async function waitForLine(file: string, pattern: RegExp, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const text = await readFile(file, 'utf8').catch(() => '');
    if (pattern.test(text)) return;
    if (Date.now() > deadline) throw new Error(`${path.basename(file)}: no line matching ${pattern} within ${timeoutMs} ms:\n${text.slice(-2000)}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function waitFor<T>(what: string, probe: () => Promise<T | undefined>, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`${what} did not happen within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

/** The structured log lines (pino JSON) of every worker, each with the worker's pid. */
async function workerEvents(): Promise<{ worker: string; pid: number; event: string; jobId?: string; clipId?: number }[]> {
  const events = [];
  for (const file of workerLogs) {
    for (const line of (await readFile(file, 'utf8')).split('\n')) {
      if (!line.startsWith('{')) continue;
      const entry = JSON.parse(line) as { pid: number; event?: string; jobId?: string; clipId?: number };
      if (entry.event) events.push({ worker: path.basename(file, '.log'), pid: entry.pid, event: entry.event, jobId: entry.jobId, clipId: entry.clipId });
    }
  }
  return events;
}

/** Processes (not zombies) whose process group is `pgid`, read from /proc. */
async function livingInGroup(pgid: number): Promise<number[]> {
  const living: number[] = [];
  for (const name of await readdir('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    const stat = await readFile(`/proc/${name}/stat`, 'utf8').catch(() => '');
    // pid (comm) state ppid pgrp …: comm may hold spaces, so split after its closing parenthesis.
    const [state, , pgrp] = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    if (Number(pgrp) === pgid && state !== 'Z') living.push(Number(name));
  }
  return living;
}

beforeAll(async () => {
  const services = testServices();
  database = await createTestDatabase();
  const bucket = `tw-scale-${tag}`;
  storage = createObjectStorage(loadConfig({ ...process.env, S3_BUCKET: bucket }));
  team = await createTeamFixture(database.handle.db, 'Scale');
  workDir = await mkdtemp(path.join(services.runDir, 'scale-'));

  const ports = await freePorts(2);
  apis = ports.map((p) => `http://127.0.0.1:${p}`);
  const shared: NodeJS.ProcessEnv = {
    ...process.env,
    // As deployed: production mode, one public address (a load balancer would own it), one secret.
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PUBLIC_URL: apis[0],
    DATABASE_URL: database.url,
    S3_BUCKET: bucket,
    SESSION_SECRET: randomBytes(32).toString('base64url'),
    STATIC_DIR: '/nonexistent',
    LOG_LEVEL: 'info',
  };
  // The one-shot step compose runs before the app (docker/ensure-bucket.ts) creates the bucket.
  const setup = await start('storage-setup', 'docker/ensure-bucket.ts', shared).exited;
  expect(setup).toEqual({ code: 0, signal: null });
  ports.forEach((port, i) => start(`api-${i + 1}`, 'server/main.ts', { ...shared, PORT: String(port), LOG_LEVEL: 'warn' }));
  for (let i = 1; i <= WORKERS; i += 1) start(`worker-${i}`, 'workers/main.ts', { ...shared, WORKER_CONCURRENCY: '1', JOB_MAINTENANCE_SECONDS: '5' });
  await Promise.all([...apis.map((base) => waitForHttpOk(`${base}/api/ready`, 40_000)), ...workerLogs.map((log) => waitForLine(log, /"worker started"/, 40_000))]);
}, 60_000);

afterAll(async () => {
  // SIGTERM, then SIGKILL after 8 s (ManagedChild also kills what a child left in its process group).
  const exits = await Promise.all(children.map((c) => c.stop(8_000)));
  const leftovers = await waitFor(
    'every process group gone',
    async () => {
      const living = (await Promise.all(children.map((c) => livingInGroup(c.pid!)))).flat();
      return living.length === 0 ? living : undefined;
    },
    5_000,
  ).catch(async () => (await Promise.all(children.map((c) => livingInGroup(c.pid!)))).flat());
  console.log(`scale-out: stopped ${children.length} processes: ${children.map((c, i) => `${c.name} ${exits[i]!.signal ?? `exit ${exits[i]!.code}`}`).join(', ')}`);
  storage?.destroy();
  await database?.drop();
  if (workDir) await rm(workDir, { recursive: true, force: true });
  expect(children.every((c) => c.hasExited)).toBe(true);
  expect(leftovers).toEqual([]);
}, 30_000);

test('both API processes are ready: database, job queue schema and bucket', async () => {
  for (const base of apis) {
    const res = await new CookieJar().fetch(base, 'GET', '/api/ready');
    expect(res).toEqual({ status: 200, body: { status: 'ready', checks: { database: 'ok', jobQueue: 'ok', objectStore: 'ok' } } });
  }
});

test('a session made on API 1 works on API 2, its CSRF token too, and sign-out on API 2 ends it on API 1', async () => {
  const [one, two] = apis as [string, string];
  const jar = await signIn(one, team.accounts.analyst.email);
  const me = await jar.fetch(two, 'GET', '/api/auth/me');
  expect(me.status).toBe(200);
  expect(me.body.user.email).toBe(team.accounts.analyst.email);

  // The token API 1 handed out at sign-in verifies on API 2 (same secret, session in PostgreSQL).
  const tokenFromOne = jar.get('XSRF-TOKEN');
  const created = await jar.fetch(two, 'POST', '/api/film-sessions', { teamId: team.teamId, kind: 'practice', title: 'Tuesday inside run', date: '2026-09-15' });
  expect(created.status).toBe(201);
  expect(jar.get('XSRF-TOKEN')).toBe(tokenFromOne);
  const forged = await jar.fetch(two, 'POST', '/api/film-sessions', { teamId: team.teamId, kind: 'practice', title: 'x', date: '2026-09-15' }, { 'x-xsrf-token': 'forged.token' });
  expect(forged.status).toBe(403);

  expect((await jar.fetch(two, 'POST', '/api/auth/logout')).status).toBe(204);
  expect((await jar.fetch(one, 'GET', '/api/auth/me')).status).toBe(401);
});

test(`${CLIPS} clips uploaded on API 1 and ${MAILS} invitations on API 2: each job runs exactly once, spread over the workers`, async () => {
  const [one, two] = apis as [string, string];
  const analyst = await signIn(one, team.accounts.analyst.email);
  const admin = await signIn(two, team.accounts.admin.email);
  const session = await analyst.fetch(one, 'POST', '/api/film-sessions', { teamId: team.teamId, kind: 'game', title: 'Week 7 vs Cobble Hill', date: '2026-10-09', opponent: 'Cobble Hill' });
  expect(session.status).toBe(201);
  const sessionId = session.body.id as number;

  const sources: LavfiSource[] = ['testsrc2', 'testsrc', 'smptebars', 'rgbtestsrc', 'color=c=0x336699', 'color=c=0x993366'];
  const form = new FormData();
  form.append('angle', 'sideline');
  for (let i = 0; i < CLIPS; i += 1) {
    const file = await makeClip(workDir, { seconds: 1, source: sources[i]!, name: `rep-${i + 1}.mp4` });
    form.append('files', new Blob([await readFile(file)], { type: 'video/mp4' }), `rep-${i + 1}.mp4`);
  }
  const upload = await analyst.fetch(one, 'POST', `/api/film-sessions/${sessionId}/clips`, form);
  expect(upload.status).toBe(201);
  const clipIds = (upload.body.clips as { id: number }[]).map((c) => c.id).sort((a, b) => a - b);
  expect(clipIds).toHaveLength(CLIPS);

  const recipients = Array.from({ length: MAILS }, (_, i) => `scale-${tag}-${i + 1}@invited.test`);
  for (const email of recipients) expect((await admin.fetch(two, 'POST', `/api/teams/${team.teamId}/invitations`, { email, role: 'coach' })).status).toBe(201);

  const db = database.handle.db;
  const clips = await waitFor(
    'every clip ready',
    async () => {
      const rows = await db.selectFrom('clips').select(['id', 'status', 'failure_reason']).where('id', 'in', clipIds).orderBy('id').execute();
      return rows.every((r) => r.status === 'ready' || r.status === 'failed') ? rows : undefined;
    },
    45_000,
  );
  expect(clips.map((c) => [c.id, c.status, c.failure_reason])).toEqual(clipIds.map((id) => [id, 'ready', null]));
  const mails = await waitFor(
    'every invitation mailed',
    async () => {
      const ours = (await listMail()).filter((m) => recipients.some((r) => m.to.includes(r)));
      return ours.length >= MAILS ? ours : undefined;
    },
    30_000,
  );
  // A moment for a duplicate delivery, if any, to show up.
  await new Promise((r) => setTimeout(r, 1500));
  const finalMails = (await listMail()).filter((m) => recipients.some((r) => m.to.includes(r)));
  expect(finalMails).toHaveLength(MAILS);
  expect(recipients.map((r) => finalMails.filter((m) => m.to.includes(r)).length)).toEqual(Array(MAILS).fill(1));
  expect(mails.length).toBe(MAILS);

  // The queue's own record: one job per clip and per mail, each completed on its first attempt.
  const jobs = (await db
    .selectFrom('pgboss.job' as never)
    .select(['id' as never, 'name' as never, 'state' as never, 'retry_count' as never, 'data' as never])
    .where('name' as never, 'in', ['clip.process', 'mail.send'] as never)
    .execute()) as unknown as { id: string; name: string; state: string; retry_count: number; data: { clipId?: number } }[];
  const clipJobs = jobs.filter((j) => j.name === 'clip.process');
  const mailJobs = jobs.filter((j) => j.name === 'mail.send');
  expect(clipJobs.map((j) => j.data.clipId).sort((a, b) => a! - b!)).toEqual(clipIds);
  expect(mailJobs).toHaveLength(MAILS);
  expect(jobs.map((j) => [j.state, j.retry_count])).toEqual(jobs.map(() => ['completed', 0]));

  // The workers' logs: each job's handler finished exactly once, in one worker.
  const events = await workerEvents();
  const clipReady = events.filter((e) => e.event === 'clip_ready');
  const mailSent = events.filter((e) => e.event === 'mail_sent');
  expect(clipReady.map((e) => e.clipId).sort((a, b) => a! - b!)).toEqual(clipIds);
  expect(clipReady.map((e) => e.jobId).sort()).toEqual(clipJobs.map((j) => j.id).sort());
  expect(mailSent.map((e) => e.jobId).sort()).toEqual(mailJobs.map((j) => j.id).sort());
  expect(events.filter((e) => e.event === 'job_failed_attempt')).toEqual([]);
  const perWorker = new Map<string, number>();
  for (const e of [...clipReady, ...mailSent]) perWorker.set(`${e.worker} (pid ${e.pid})`, (perWorker.get(`${e.worker} (pid ${e.pid})`) ?? 0) + 1);
  console.log(`scale-out: jobs per worker: ${[...perWorker].map(([w, n]) => `${w}: ${n}`).join(', ')}`);
  expect(perWorker.size).toBeGreaterThanOrEqual(2);

  // One set of outputs per clip, and one original each.
  for (const id of clipIds) {
    const folder = (await storage.list(`teams/${team.teamId}/clips/${id}/`)).map((k) => k.split('/').pop()).sort();
    expect([id, folder.filter((n) => n !== 'web.mp4')]).toEqual([id, ['poster.jpg', 'strip.jpg']]);
  }
  expect(await storage.list(`teams/${team.teamId}/sessions/${sessionId}/originals/`)).toHaveLength(CLIPS);
}, 60_000);
