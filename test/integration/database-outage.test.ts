/**
 * PostgreSQL stops and starts again while the API serves (issue 7): meanwhile every request answers
 * a clear 503 service_unavailable within a few seconds (never a 500, never a hang), /api/health
 * says the database is unavailable; afterwards the same app object, never rebuilt, serves again,
 * and the sessions (kept in PostgreSQL) are still valid. A grade saved during the outage is
 * refused with 503; the same PUT sent again after recovery, as the grading desk's offline queue
 * does, stores it exactly once.
 *
 * The shared test cluster must keep running for the other test files, so this file starts a
 * throwaway cluster of its own (scripts/stack/postgres-cluster.ts, a free port, data under the
 * run's folder), migrates it, and stops it with `pg_ctl stop -m fast`.
 */
import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { createDatabase, type DatabaseHandle } from '../../db/database';
import { migrateToLatest } from '../../db/migrator';
import { freePorts } from '../../scripts/stack/ports';
import { PortInUseError, PostgresCluster, socketDirFor } from '../../scripts/stack/postgres-cluster';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/core/config';
import type { AppContext } from '../../server/core/context';
import { jobPolicies } from '../../server/core/jobs';
import { createLogger } from '../../server/core/logger';
import { createJobQueue, type JobQueue } from '../../server/core/queue';
import { createObjectStorage, type ObjectStorage } from '../../server/core/storage';
import { Browser } from '../../bench/drills/lib/load-mix';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';

jest.setTimeout(60_000);

/** A request that takes longer than this during the outage counts as a hang. */
const ANSWER_WITHIN_MS = 6_000;
const DATABASE = 'trenchwork_outage';

let base: string;
let ownsBase = false;
let cluster: PostgresCluster;
let database: DatabaseHandle;
let jobs: JobQueue;
let storage: ObjectStorage;
let ctx: AppContext;
let server: Server;
let agent: ReturnType<typeof request.agent>;
let xsrf = '';
let team: TeamFixture;
let sessionId: number;
let snapId: number;
let appBuilds = 0;
let baseUrl: string;
const trafficCoaches: string[] = [];

function tokenFrom(res: request.Response): string | undefined {
  const cookies = ([] as string[]).concat((res.headers['set-cookie'] as unknown as string[] | undefined) ?? []);
  for (const cookie of cookies) {
    const match = /^XSRF-TOKEN=([^;]*)/.exec(cookie);
    if (match) return decodeURIComponent(match[1]!);
  }
  return undefined;
}

async function startCluster(): Promise<PostgresCluster> {
  const options = { dataDir: join(base, 'pg'), socketDir: socketDirFor(join(base, 'pg-run')), logFile: join(base, 'postgres.log'), throwaway: true };
  await new PostgresCluster({ ...options, port: 0 }).initIfMissing();
  // The free port is only reserved until PostgreSQL binds it: try another if something took it.
  for (let attempt = 1; ; attempt += 1) {
    const [port] = await freePorts(1);
    const candidate = new PostgresCluster({ ...options, port: port! });
    try {
      await candidate.start();
      return candidate;
    } catch (error) {
      if (!(error instanceof PortInUseError) || attempt >= 3) throw error;
    }
  }
}

/** GET or PUT with a deadline; resolves with the status and how long the answer took. */
async function timed(send: () => request.Test): Promise<{ res: request.Response; ms: number }> {
  const started = Date.now();
  const res = await send().timeout({ deadline: ANSWER_WITHIN_MS });
  return { res, ms: Date.now() - started };
}

const grade = { assignment: 'right', footwork: 'plus', hands: 'minus', padLevel: 'plus', effort: 'plus', knockdowns: 1, note: 'Won with the inside hand.', version: 0 };
const gradePath = () => `/api/snaps/${snapId}/grades/${team.playerIds[0]}`;
const readPaths = () => [
  '/api/auth/me',
  `/api/teams/${team.teamId}`,
  `/api/players/${team.playerIds[0]}/development`,
  `/api/film-sessions/${sessionId}/clips`,
  `/api/film-sessions/${sessionId}/desk`,
];

beforeAll(async () => {
  const runDir = process.env.TW_TEST_RUN_DIR;
  if (runDir) {
    base = join(runDir, `database-outage-${process.pid}-${randomBytes(3).toString('hex')}`);
    mkdirSync(base, { recursive: true });
  } else {
    base = mkdtempSync(join(tmpdir(), 'tw-database-outage-'));
  }
  ownsBase = true;
  cluster = await startCluster();
  await cluster.ensureDatabase(DATABASE);
  const url = cluster.url(DATABASE);

  // Mirrors test/support/test-app.ts, on this file's own cluster.
  database = createDatabase(url, { max: 10 });
  await migrateToLatest(database.db);
  const config = loadConfig({
    ...process.env,
    NODE_ENV: 'test',
    LOG_LEVEL: process.env.TEST_LOG_LEVEL ?? 'silent',
    DATABASE_URL: url,
    S3_BUCKET: `tw-test-${randomBytes(5).toString('hex')}`,
    STATIC_DIR: '/nonexistent',
  });
  jobs = createJobQueue(url, { max: 3, policies: jobPolicies(config.media.timeoutMs) });
  await jobs.start();
  storage = createObjectStorage(config);
  if (config.s3.endpoint) await storage.ensureBucket();
  ctx = { config, db: database.db, logger: createLogger(config.logLevel), jobs, storage, now: () => new Date() };
  const app = createApp(ctx, database.pool);
  appBuilds += 1;
  server = createServer(app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  team = await createTeamFixture(database.db, 'Outage');
  const session = await database.db
    .insertInto('film_sessions')
    .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 2', date: '2026-09-11', opponent: 'Hollow Creek' })
    .returning('id')
    .executeTakeFirstOrThrow();
  sessionId = session.id;
  snapId = (await database.db.insertInto('snaps').values({ session_id: sessionId, order: 1 }).returning('id').executeTakeFirstOrThrow()).id;

  // More coaches for the keep-alive traffic while the database goes down.
  for (let i = 0; i < 6; i += 1) {
    const email = `traffic${i}.${team.teamId}@outage.test`;
    const user = await database.db
      .insertInto('users')
      .values({ email, name: `Traffic coach ${i}`, password_hash: (await database.db.selectFrom('users').select('password_hash').where('id', '=', team.accounts.coach.userId).executeTakeFirstOrThrow()).password_hash })
      .returning('id')
      .executeTakeFirstOrThrow();
    await database.db.insertInto('memberships').values({ user_id: user.id, team_id: team.teamId, role: 'coach', player_id: null }).execute();
    trafficCoaches.push(email);
  }

  agent = request.agent(baseUrl);
  xsrf = tokenFrom(await agent.get('/api/health')) ?? '';
  const login = await agent.post('/api/auth/login').set('X-XSRF-TOKEN', xsrf).send({ email: team.accounts.coach.email, password: TEST_PASSWORD });
  expect(login.status).toBe(200);
  xsrf = tokenFrom(login) ?? xsrf;
}, 60_000);

afterAll(async () => {
  await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  // The database may be down if a test failed half way: start it so the queue can stop cleanly.
  if (cluster && !cluster.isRunning()) await cluster.start().catch(() => undefined);
  await jobs?.stop().catch(() => undefined);
  storage?.destroy();
  await database?.close().catch(() => undefined);
  await cluster?.stop('immediate').catch(() => undefined);
  if (ownsBase) rmSync(base, { recursive: true, force: true });
});

test('before the outage everything answers', async () => {
  expect((await agent.get('/api/health')).body).toMatchObject({ status: 'ok', database: 'ok' });
  for (const path of readPaths()) expect([path, (await agent.get(path)).status]).toEqual([path, 200]);
});

test('while PostgreSQL is down: 503 service_unavailable within seconds, health says unavailable', async () => {
  // Requests keep coming while the server shuts down: each is answered, 200 or 503, never 500.
  // Browsers on keep-alive connections (fetch), each signed in as its own coach. Grade saves run in
  // the mix (their transactions get cut off): 200 the first time, 409 after (the same version 0
  // again), 503 once the database is gone. No request may go unanswered: a connection closed under
  // a request (-1 here) is what a failed session touch after the answer used to cause.
  const during: number[] = [];
  const unanswered: string[] = [];
  let stopping = true;
  const browsers = await Promise.all(
    trafficCoaches.map(async (email) => {
      const browser = new Browser(baseUrl);
      await browser.signIn(email);
      return browser;
    }),
  );
  const client = async (browser: Browser, i: number) => {
    const paths = readPaths().slice(1);
    const ownGrade = `/api/snaps/${snapId}/grades/${team.playerIds[1 + (i % 2)]}`;
    while (stopping) {
      for (const [method, path, body] of [...paths.map((p) => ['GET', p, undefined] as const), ['PUT', ownGrade, grade] as const]) {
        try {
          const res = await browser.send(method, path, body, ANSWER_WITHIN_MS);
          await res.arrayBuffer();
          during.push(res.status);
        } catch (error) {
          during.push(-1);
          unanswered.push(`${method} ${path}: ${(error as Error).message} ${String((error as { cause?: unknown }).cause ?? '')}`);
        }
      }
    }
  };
  const traffic = Promise.all(browsers.map(client));
  await new Promise((resolve) => setTimeout(resolve, 150));
  await cluster.stop('fast');
  stopping = false;
  await traffic;
  expect(cluster.isRunning()).toBe(false);
  const tally = (list: number[]) => [...new Set(list)].sort().map((s) => `${s}×${list.filter((x) => x === s).length}`).join(' ');
  console.log(`database-outage: ${during.length} requests from ${browsers.length} keep-alive clients while PostgreSQL shut down: ${tally(during)}`);
  expect(unanswered).toEqual([]);
  expect(during.filter((s) => s === 200).length).toBeGreaterThan(0);
  expect(during.filter((s) => s !== 200 && s !== 409 && s !== 503)).toEqual([]);

  // A monitor's probe (no cookies) reaches the health route itself.
  const probe = await timed(() => request(server).get('/api/health'));
  expect(probe.res.status).toBe(503);
  expect(probe.res.body).toMatchObject({ status: 'degraded', database: 'unavailable' });
  expect(probe.ms).toBeLessThan(ANSWER_WITHIN_MS);
  // With a session cookie the session store (PostgreSQL) is asked first: the generic clear 503.
  const signedInProbe = await timed(() => agent.get('/api/health'));
  expect([signedInProbe.res.status, signedInProbe.res.body?.error?.code]).toEqual([503, 'service_unavailable']);
  expect(signedInProbe.ms).toBeLessThan(ANSWER_WITHIN_MS);

  for (const path of readPaths()) {
    const { res, ms } = await timed(() => agent.get(path));
    expect([path, res.status, res.body?.error?.code]).toEqual([path, 503, 'service_unavailable']);
    expect(res.body.error.message).toEqual(expect.any(String));
    expect(res.headers['retry-after']).toBeDefined();
    expect(ms).toBeLessThan(ANSWER_WITHIN_MS);
  }

  // The grading desk saves a grade: refused, clearly, so the desk keeps it in its offline queue.
  const put = await timed(() => agent.put(gradePath()).set('X-XSRF-TOKEN', xsrf).send(grade));
  expect([put.res.status, put.res.body?.error?.code]).toEqual([503, 'service_unavailable']);
  expect(put.ms).toBeLessThan(ANSWER_WITHIN_MS);

  // Signing in needs the database too: the same clear answer, not "wrong password".
  const anonymous = request.agent(server);
  const pre = tokenFrom(await anonymous.get('/api/health')) ?? '';
  expect(pre).not.toBe('');
  const login = await timed(() => anonymous.post('/api/auth/login').set('X-XSRF-TOKEN', pre).send({ email: team.accounts.admin.email, password: TEST_PASSWORD }));
  expect([login.res.status, login.res.body?.error?.code]).toEqual([503, 'service_unavailable']);
});

test('after PostgreSQL is back: the same app serves again, the session still holds, the queued grade lands once', async () => {
  await cluster.start();
  // The pool drops its dead connections and opens new ones: give it a few tries, no restart.
  const deadline = Date.now() + 15_000;
  let health = await agent.get('/api/health');
  while (health.status !== 200 && Date.now() < deadline) {
    await new Promise((resolve) => setTimeout(resolve, 200));
    health = await agent.get('/api/health');
  }
  expect(health.body).toMatchObject({ status: 'ok', database: 'ok' });
  expect(appBuilds).toBe(1);

  // Same cookie as before the outage: the session row survived in PostgreSQL.
  const me = await agent.get('/api/auth/me');
  expect(me.status).toBe(200);
  expect(me.body.user.id).toBe(team.accounts.coach.userId);
  for (const path of readPaths()) expect([path, (await agent.get(path)).status]).toEqual([path, 200]);

  // The offline queue resends the PUT it could not deliver.
  const resent = await agent.put(gradePath()).set('X-XSRF-TOKEN', xsrf).send(grade);
  expect(resent.status).toBe(200);
  expect(resent.body).toMatchObject({ version: 1, assignment: 'right', knockdowns: 1, note: grade.note });
  // A second delivery of the same queued PUT (say, its answer was lost) stores nothing more: 409 with the stored grade.
  const again = await agent.put(gradePath()).set('X-XSRF-TOKEN', xsrf).send(grade);
  expect([again.status, again.body?.error?.code]).toEqual([409, 'stale_version']);
  expect(again.body.error.current).toMatchObject({ version: 1 });

  const rows = await database.db.selectFrom('grades').select(['version', 'note']).where('snap_id', '=', snapId).where('player_id', '=', team.playerIds[0]!).execute();
  expect(rows).toEqual([{ version: 1, note: grade.note }]);
});
