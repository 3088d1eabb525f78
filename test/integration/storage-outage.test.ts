/**
 * The object store goes away while the API serves (issue 7). The app gets a private s3rver
 * (scripts/s3-fake.ts as its own process, like the stack runs it), which this file kills and starts
 * again on the same port and folder:
 *
 * - store killed: an upload answers 503 service_unavailable within seconds, no clip row, no job;
 *   media answers 503; /api/ready names the object store;
 * - store killed in the middle of a large upload (the body is held back until the store is dead,
 *   so the timing is not left to chance): the same 503, nothing recorded;
 * - store back on the same port: uploads work again without rebuilding the app, and no visible
 *   object is left that no clip refers to (multipart parts the store had taken before it died are
 *   counted and printed: they cannot be aborted while the store is gone);
 * - full disk: a store that refuses every write as a full S3-compatible store does (507), reads and
 *   deletes still served: 503, nothing recorded; with space again uploads work. (A real full disk
 *   under s3rver was tried on a tmpfs: s3rver crashes on ENOSPC, which is the "killed" case.)
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { appendFile, readFile } from 'node:fs/promises';
import { createServer, request as httpRequest, type ClientRequest, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { basename, join, resolve } from 'node:path';
import { tsxChild } from '../../scripts/stack/entries';
import { ManagedChild } from '../../scripts/stack/managed-child';
import type { ApiClient } from '../support/api-client';
import { createSession } from '../support/film';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { makeClip, pseudoRandomBytes } from '../support/media-fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(60_000);

const ROOT = resolve(__dirname, '../..');
const ANSWER_WITHIN_MS = 10_000;

/** A private s3rver: its folder and port stay the same across restarts, like a store coming back. */
class PrivateStore {
  private child: ManagedChild | undefined;
  port = 0;

  constructor(
    readonly dir: string,
    private readonly log: string,
  ) {}

  async start(): Promise<number> {
    this.child = new ManagedChild({
      ...tsxChild('s3-private', 'scripts/s3-fake.ts', ROOT, { ...process.env, TW_S3_DIR: this.dir, TW_S3_PORT: String(this.port), S3_BUCKET: 'trenchwork-media' }, { file: this.log }),
      ipc: true,
    });
    const child = this.child;
    const ready = await child.waitForReady<{ port: number }>(20_000).catch((error: Error) => {
      throw new Error(`${error.message}\n${child.logTail()}`);
    });
    this.port = ready.port;
    return this.port;
  }

  /** SIGKILL: the store vanishes mid-sentence, as a crashed or unplugged one does. */
  async kill(): Promise<void> {
    const child = this.child;
    this.child = undefined;
    child?.kill();
    await child?.exited;
  }

  get endpoint(): string {
    return `http://127.0.0.1:${this.port}`;
  }
}

interface Setup {
  t: TestApp;
  server: Server;
  baseUrl: string;
  team: TeamFixture;
  coach: ApiClient;
  sessionId: number;
}

async function setUp(store: PrivateStore, label: string): Promise<Setup> {
  const t = await startTestApp({ S3_ENDPOINT: store.endpoint });
  const server = createServer(t.app);
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  const team = await createTeamFixture(t.ctx.db, label);
  const coach = t.client();
  expect((await coach.login(team.accounts.coach.email, TEST_PASSWORD)).status).toBe(200);
  const sessionId = await createSession(coach, team.teamId);
  return { t, server, baseUrl: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, team, coach, sessionId };
}

async function tearDown(s: Setup | undefined): Promise<void> {
  if (!s) return;
  await new Promise<void>((done) => s.server.close(() => done()));
  await s.t.close();
}

async function clipRows(s: Setup) {
  return s.t.ctx.db.selectFrom('clips').select(['id', 'original_key', 'status']).where('session_id', '=', s.sessionId).orderBy('id').execute();
}

async function clipJobs(s: Setup): Promise<number> {
  const { rows } = await s.t.database.handle.pool.query<{ n: number }>(`select count(*)::int as n from pgboss.job where name = 'clip.process'`);
  return rows[0]!.n;
}

/** Objects in the bucket that no clip row refers to. */
async function orphanObjects(s: Setup): Promise<string[]> {
  const referenced = new Set((await s.t.ctx.db.selectFrom('clips').select('original_key').execute()).map((r) => r.original_key).filter(Boolean));
  return (await s.t.ctx.storage.list('')).filter((key) => !referenced.has(key));
}

/** Multipart uploads s3rver still holds parts of (its folder `<bucket>/._S3rver_uploads/<id>`). */
function pendingMultipartUploads(store: PrivateStore, bucket: string): number {
  const dir = join(store.dir, bucket, '._S3rver_uploads');
  return existsSync(dir) ? readdirSync(dir).length : 0;
}

async function timedUpload(s: Setup, file: string) {
  const started = Date.now();
  const res = await s.coach.upload(`/api/film-sessions/${s.sessionId}/clips`, [{ path: file }]);
  return { res, ms: Date.now() - started };
}

function cookieHeader(client: ApiClient): string {
  const jar = (client.agent as unknown as { jar: { getCookies(access: unknown): { name: string; value: string }[] } }).jar;
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const { CookieAccessInfo } = require('cookiejar') as { CookieAccessInfo: new (domain: string, path: string, secure: boolean, script: boolean) => unknown };
  return jar
    // script = false: the session cookie is HttpOnly, and this is the "browser", not a script in it.
    .getCookies(new CookieAccessInfo('127.0.0.1', '/', false, false))
    .map((c) => `${c.name}=${c.value}`)
    .join('; ');
}

/**
 * A multipart upload over real HTTP whose body is held back after `holdAfter` bytes until `release`
 * resolves: the server has started storing (the first multipart part is on its way) when the test
 * pulls the store away, whatever the machine's speed.
 */
function heldUpload(s: Setup, file: string, holdAfter: number, release: Promise<void>): Promise<{ status: number; body: any }> {
  const boundary = `----trenchwork-outage-${randomBytes(8).toString('hex')}`;
  const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="files"; filename="${basename(file)}"\r\nContent-Type: video/mp4\r\n\r\n`);
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
  const url = new URL(`/api/film-sessions/${s.sessionId}/clips`, s.baseUrl);
  return new Promise((resolvePromise, reject) => {
    const req = httpRequest(
      {
        host: url.hostname,
        port: url.port,
        path: url.pathname,
        method: 'POST',
        headers: {
          cookie: cookieHeader(s.coach),
          'x-xsrf-token': s.coach.xsrfToken ?? '',
          'content-type': `multipart/form-data; boundary=${boundary}`,
          'content-length': String(head.length + statSync(file).size + tail.length),
        },
      },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => {
          const text = Buffer.concat(chunks).toString('utf8');
          let body: unknown = text;
          try {
            body = JSON.parse(text);
          } catch {
            // Left as text for the assertion message.
          }
          resolvePromise({ status: res.statusCode ?? 0, body });
        });
      },
    );
    // The server may answer (503) and close before the whole body is sent: that is an answer, not a failure.
    req.on('error', (error) => (req.writableEnded ? undefined : reject(error)));
    void (async () => {
      req.write(head);
      const whole = await readFile(file);
      req.write(whole.subarray(0, holdAfter));
      await release;
      const rest = whole.subarray(holdAfter);
      for (let i = 0; i < rest.length && !req.destroyed; i += 1024 * 1024) {
        if (!req.write(rest.subarray(i, i + 1024 * 1024))) await drainedOrClosed(req);
      }
      if (!req.destroyed) req.end(tail);
    })().catch(reject);
  });
}

function drainedOrClosed(req: ClientRequest): Promise<void> {
  return new Promise((done) => {
    const settle = () => {
      req.off('drain', settle);
      req.off('close', settle);
      done();
    };
    req.on('drain', settle);
    req.on('close', settle);
  });
}

/** A real MP4 head (so the content check passes) followed by `bytes` of filler. */
async function largeUpload(dir: string, bytes: number, name = 'large.mp4'): Promise<string> {
  const seed = await makeClip(dir, { seconds: 1, width: 160, height: 120, source: 'mandelbrot', name: `seed-${name}` });
  const path = join(dir, name);
  writeFileSync(path, await readFile(seed));
  await appendFile(path, pseudoRandomBytes(bytes, 11));
  return path;
}

let base: string;

beforeAll(() => {
  const runDir = process.env.TW_TEST_RUN_DIR;
  base = runDir ? join(runDir, `storage-outage-${process.pid}-${randomBytes(3).toString('hex')}`) : mkdtempSync(join(tmpdir(), 'tw-storage-outage-'));
  mkdirSync(base, { recursive: true });
});

afterAll(() => {
  rmSync(base, { recursive: true, force: true });
});

describe('the store goes away and comes back', () => {
  let store: PrivateStore;
  let s: Setup;
  let files: string[];
  let large: string;

  beforeAll(async () => {
    store = new PrivateStore(join(base, 's3'), join(base, 's3.log'));
    await store.start();
    s = await setUp(store, 'Storage');
    files = await Promise.all(
      (['testsrc2', 'smptebars', 'testsrc', 'rgbtestsrc'] as const).map((source, i) => makeClip(base, { seconds: 1, width: 160, height: 120, source, name: `small-${i}.mp4` })),
    );
    large = await largeUpload(base, 24 * 1024 * 1024);
  }, 60_000);

  afterAll(async () => {
    await tearDown(s);
    await store?.kill();
  });

  test('with the store up an upload is stored', async () => {
    const { res } = await timedUpload(s, files[0]!);
    expect(res.status).toBe(201);
    const rows = await clipRows(s);
    expect(rows).toHaveLength(1);
    expect(await s.t.ctx.storage.head(rows[0]!.original_key!)).toMatchObject({ size: statSync(files[0]!).size });
  });

  test('store killed: uploads answer 503 within seconds, nothing is recorded, /api/ready names the store', async () => {
    const [rowsBefore, jobsBefore] = [await clipRows(s), await clipJobs(s)];
    // No worker runs here: give the stored clip a poster (its own original will do) so that reading media needs the store.
    await s.t.ctx.db.updateTable('clips').set({ poster_key: rowsBefore[0]!.original_key }).where('id', '=', rowsBefore[0]!.id).execute();
    expect((await s.coach.get(`/api/clips/${rowsBefore[0]!.id}/poster`)).status).toBe(200);
    await store.kill();

    const { res, ms } = await timedUpload(s, files[1]!);
    expect([res.status, res.body?.error?.code]).toEqual([503, 'service_unavailable']);
    expect(res.body.error.message).toMatch(/storage/i);
    expect(ms).toBeLessThan(ANSWER_WITHIN_MS);
    console.log(`storage-outage: upload with the store gone answered ${res.status} in ${ms} ms`);
    expect(await clipRows(s)).toEqual(rowsBefore);
    expect(await clipJobs(s)).toBe(jobsBefore);

    // Reading media needs the store too: the same clear answer.
    const media = await s.coach.get(`/api/clips/${rowsBefore[0]!.id}/poster`);
    expect([media.status, media.body?.error?.code]).toEqual([503, 'service_unavailable']);

    const ready = await s.coach.get('/api/ready');
    expect(ready.status).toBe(503);
    expect(ready.body.checks).toMatchObject({ database: 'ok', objectStore: 'unavailable' });
    // Everything that does not touch the store still works.
    expect((await s.coach.get(`/api/film-sessions/${s.sessionId}/clips`)).status).toBe(200);
  });

  test('store killed in the middle of a large upload: 503, nothing recorded', async () => {
    await store.start();
    const [rowsBefore, jobsBefore] = [await clipRows(s), await clipJobs(s)];
    let release!: () => void;
    const released = new Promise<void>((r) => (release = r));
    // 9 MiB: past the first 8 MiB multipart part, which the server sends on to the store.
    const upload = heldUpload(s, large, 9 * 1024 * 1024, released);
    let answeredEarly: unknown;
    void upload.then((r) => (answeredEarly = r));
    // The server has begun a multipart upload in the store once s3rver has a folder for it.
    const deadline = Date.now() + 10_000;
    while (pendingMultipartUploads(store, s.t.ctx.storage.bucket) === 0 && answeredEarly === undefined && Date.now() < deadline) await new Promise((r) => setTimeout(r, 50));
    try {
      expect(answeredEarly).toBeUndefined();
      expect(pendingMultipartUploads(store, s.t.ctx.storage.bucket)).toBeGreaterThan(0);
    } finally {
      await store.kill();
      release();
    }
    const res = await upload;
    expect([res.status, res.body?.error?.code]).toEqual([503, 'service_unavailable']);
    expect(await clipRows(s)).toEqual(rowsBefore);
    expect(await clipJobs(s)).toBe(jobsBefore);
  });

  test('store back on the same port: uploads work again, no object is orphaned', async () => {
    await store.start();
    const { res } = await timedUpload(s, files[2]!);
    expect(res.status).toBe(201);
    // The upload refused while the store was down is accepted now (it was never half-recorded as a duplicate).
    const retried = await timedUpload(s, files[1]!);
    expect(retried.res.status).toBe(201);
    expect(retried.res.body.skipped).toEqual([]);
    const rows = await clipRows(s);
    expect(rows).toHaveLength(3);
    expect(await clipJobs(s)).toBe(3);
    expect(await orphanObjects(s)).toEqual([]);
    const ready = await s.coach.get('/api/ready');
    expect(ready.status).toBe(200);
    console.log(`storage-outage: multipart uploads left in the store by the upload cut off mid-way: ${pendingMultipartUploads(store, s.t.ctx.storage.bucket)}`);
  });
});

/**
 * A store whose disk is full, as S3-compatible stores answer then (MinIO: 507 XMinioStorageFull):
 * every write (PUT, and POST but for multi-object delete) is refused; reads and deletes go through
 * to the real s3rver behind it. A real full disk under s3rver does not serve: s3rver crashes on
 * ENOSPC (an unhandled stream error; tried on a tmpfs), which is the "store killed" case above.
 */
class FullDiskProxy {
  full = false;
  refused = 0;
  private readonly server: Server;

  constructor(private readonly upstreamPort: number) {
    this.server = createServer((req, res) => {
      const url = new URL(req.url ?? '/', 'http://store');
      const write = req.method === 'PUT' || (req.method === 'POST' && !url.searchParams.has('delete'));
      if (this.full && write) {
        this.refused += 1;
        req.resume();
        req.on('end', () => {
          res.writeHead(507, { 'content-type': 'application/xml' });
          res.end(
            '<?xml version="1.0" encoding="UTF-8"?><Error><Code>XMinioStorageFull</Code>' +
              '<Message>Storage backend has reached its minimum free drive threshold. Please delete a few objects to proceed.</Message></Error>',
          );
        });
        return;
      }
      const upstream = httpRequest({ host: '127.0.0.1', port: this.upstreamPort, path: req.url, method: req.method, headers: req.headers }, (answer) => {
        res.writeHead(answer.statusCode ?? 502, answer.headers);
        answer.pipe(res);
      });
      upstream.on('error', () => res.destroy());
      req.pipe(upstream);
    });
  }

  async listen(): Promise<string> {
    await new Promise<void>((done) => this.server.listen(0, '127.0.0.1', done));
    return `http://127.0.0.1:${(this.server.address() as AddressInfo).port}`;
  }

  close(): Promise<void> {
    this.server.closeAllConnections();
    return new Promise((done) => this.server.close(() => done()));
  }
}

describe('the store refuses writes (disk full)', () => {
  let store: PrivateStore;
  let proxy: FullDiskProxy;
  let s: Setup | undefined;

  afterAll(async () => {
    await tearDown(s);
    await proxy?.close();
    await store?.kill();
  });

  test('uploads answer 503 and record nothing; once there is space again they work', async () => {
    store = new PrivateStore(join(base, 's3-full'), join(base, 's3-full.log'));
    await store.start();
    proxy = new FullDiskProxy(store.port);
    const endpoint = await proxy.listen();
    s = await setUp({ endpoint } as PrivateStore, 'Full');
    const clip = await makeClip(base, { seconds: 1, width: 160, height: 120, source: 'smptehdbars', name: 'full-disk.mp4' });
    const large = await largeUpload(base, 12 * 1024 * 1024, 'full-disk-large.mp4');
    const jobsBefore = await clipJobs(s);

    proxy.full = true;
    for (const file of [clip, large]) {
      const { res, ms } = await timedUpload(s, file);
      expect([res.status, res.body?.error?.code]).toEqual([503, 'service_unavailable']);
      expect(ms).toBeLessThan(ANSWER_WITHIN_MS);
    }
    expect(proxy.refused).toBeGreaterThanOrEqual(2);
    expect(await clipRows(s)).toEqual([]);
    expect(await clipJobs(s)).toBe(jobsBefore);
    // Reads still work on a full store.
    expect((await s.coach.get('/api/ready')).status).toBe(200);

    proxy.full = false;
    for (const file of [clip, large]) expect((await timedUpload(s, file)).res.status).toBe(201);
    expect(await clipRows(s)).toHaveLength(2);
    expect(await orphanObjects(s)).toEqual([]);
    expect(pendingMultipartUploads(store, s.t.ctx.storage.bucket)).toBe(0);
  });
});
