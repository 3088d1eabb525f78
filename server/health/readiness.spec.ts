import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import { createDatabase } from '../../db/database';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { createObjectStorage, type ObjectStorage } from '../core/storage';

/**
 * GET /api/ready against a real database and the S3 fake, with one part broken at a time: the
 * answer names that part, and /api/health (liveness, a contract) stays as it was.
 */
let t: TestApp;
let realStorage: ObjectStorage;

beforeAll(async () => {
  t = await startTestApp();
  realStorage = t.ctx.storage;
}, 30_000);

afterEach(() => {
  t.ctx.storage = realStorage;
});

afterAll(async () => {
  await t?.close();
});

test('ready when the database, the queue schema and the bucket all answer', async () => {
  const res = await t.client().get('/api/ready');
  expect(res.status).toBe(200);
  expect(res.body).toEqual({ status: 'ready', checks: { database: 'ok', jobQueue: 'ok', objectStore: 'ok' } });
  expect(res.headers['cache-control']).toBe('no-store');
});

test('a bucket that does not exist: 503, objectStore missing; liveness unaffected', async () => {
  const missing = createObjectStorage({ ...t.config, s3: { ...t.config.s3, bucket: `tw-missing-${randomBytes(4).toString('hex')}` } });
  t.ctx.storage = missing;
  try {
    const res = await t.client().get('/api/ready');
    expect(res.status).toBe(503);
    expect(res.headers['retry-after']).toBe('5');
    expect(res.body).toMatchObject({ status: 'not_ready', checks: { database: 'ok', jobQueue: 'ok', objectStore: 'missing' }, error: { code: 'service_unavailable', message: 'Not ready: objectStore missing.' } });
    expect((await t.client().get('/api/health')).status).toBe(200);
  } finally {
    missing.destroy();
  }
});

test('a store that never answers: 503 within the check time limit, objectStore unavailable', async () => {
  t.ctx.storage = { ...realStorage, list: () => new Promise<string[]>(() => undefined) };
  const started = Date.now();
  const res = await t.client().get('/api/ready');
  expect(Date.now() - started).toBeLessThan(6000);
  expect(res.status).toBe(503);
  expect(res.body.checks).toEqual({ database: 'ok', jobQueue: 'ok', objectStore: 'unavailable' });
});

test('a database that cannot be reached: database and jobQueue unavailable', async () => {
  const unreachable = createDatabase('postgres://postgres@127.0.0.1:1/nowhere', { max: 1 });
  const db = t.ctx.db;
  t.ctx.db = unreachable.db;
  try {
    const res = await t.client().get('/api/ready');
    expect(res.status).toBe(503);
    expect(res.body.checks).toEqual({ database: 'unavailable', jobQueue: 'unavailable', objectStore: 'ok' });
  } finally {
    t.ctx.db = db;
    await unreachable.close();
  }
});

test('a database without the job queue schema: jobQueue missing', async () => {
  await t.jobs.stop();
  await sql`drop schema pgboss cascade`.execute(t.ctx.db);
  const res = await t.client().get('/api/ready');
  expect(res.status).toBe(503);
  expect(res.body.checks).toEqual({ database: 'ok', jobQueue: 'missing', objectStore: 'ok' });
});
