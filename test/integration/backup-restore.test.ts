import { spawn } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import { mkdtemp, readFile, readdir, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import pg from 'pg';
import { createDatabase, type DatabaseHandle } from '../../db/database';
import { hashedObjectFileFor, objectFileFor, resolveObjectFile } from '../../scripts/backup/object-paths';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/core/config';
import type { AppContext } from '../../server/core/context';
import { jobPolicies } from '../../server/core/jobs';
import { createLogger } from '../../server/core/logger';
import { createJobQueue, type JobQueue } from '../../server/core/queue';
import { createObjectStorage, type ObjectStorage } from '../../server/core/storage';
import { ApiClient } from '../support/api-client';
import { createSession } from '../support/film';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { makeClip, pseudoRandomBytes } from '../support/media-fixtures';
import { testServices } from '../support/services';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * The backup drill: real data through the API, `scripts/backup.ts` and `scripts/restore.ts` run as
 * the operator runs them (child processes, configured by environment only), the restore going into
 * a database and a bucket that did not exist before. Afterwards every table's row count, every
 * object's SHA-256 and the grade reports read through an app on the restored database must be what
 * they were. Also: the refusals (non-empty directory, non-empty database), a damaged backup that is
 * rejected before anything changes, and --force over an existing restore.
 */
const ROOT = path.resolve(__dirname, '../..');
let source: TestApp;
let team: TeamFixture;
let workDir: string;
let backupDir: string;
let sessionId: number;
let clipId: number;
const restored = { database: '', url: '', bucket: `tw-drill-${randomBytes(4).toString('hex')}` };
const before: { counts?: Record<string, number>; objects?: Record<string, string>; reports?: Record<string, unknown> } = {};
const figures: string[] = [];

interface ScriptRun {
  code: number | null;
  stdout: string;
  stderr: string;
  ms: number;
}

/** `node --import tsx scripts/NAME.ts ARGS` with only the environment pointing it at its database and bucket. */
function runScript(name: 'backup' | 'restore', args: string[], target: { databaseUrl: string; bucket: string }): Promise<ScriptRun> {
  const started = Date.now();
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', `scripts/${name}.ts`, ...args], {
      cwd: ROOT,
      env: { ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', DATABASE_URL: target.databaseUrl, S3_BUCKET: target.bucket },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.once('error', reject);
    child.once('close', (code) => resolve({ code, stdout, stderr, ms: Date.now() - started }));
  });
}

function expectSuccess(run: ScriptRun): void {
  if (run.code !== 0) throw new Error(`exit ${run.code}\n--- stdout\n${run.stdout}\n--- stderr\n${run.stderr}`);
}

/** Every base table's row count, read independently of the scripts' own inventory. */
async function tableCounts(url: string): Promise<Record<string, number>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const tables = await client.query<{ s: string; t: string }>(
      `select table_schema as s, table_name as t from information_schema.tables
       where table_type = 'BASE TABLE' and table_schema not in ('pg_catalog', 'information_schema') order by 1, 2`,
    );
    const counts: Record<string, number> = {};
    for (const { s, t } of tables.rows) counts[`${s}.${t}`] = Number((await client.query(`select count(*) as n from "${s}"."${t}"`)).rows[0].n);
    return counts;
  } finally {
    await client.end();
  }
}

async function objectHashes(storage: ObjectStorage): Promise<Record<string, string>> {
  const hashes: Record<string, string> = {};
  for (const key of (await storage.list('')).sort()) {
    const hash = createHash('sha256');
    for await (const chunk of (await storage.get(key)).Body as Readable) hash.update(chunk as Buffer);
    hashes[key] = hash.digest('hex');
  }
  return hashes;
}

/** The reports a coach reads: grade sheet, snaps, clips of the session, and one clip. */
async function gradeReports(client: ApiClient): Promise<Record<string, unknown>> {
  const reports: Record<string, unknown> = {};
  for (const url of [`/api/film-sessions/${sessionId}/grade-sheet`, `/api/film-sessions/${sessionId}/snaps`, `/api/film-sessions/${sessionId}/clips`, `/api/clips/${clipId}`]) {
    const res = await client.get(url);
    expect([url, res.status]).toEqual([url, 200]);
    reports[url] = res.body;
  }
  return reports;
}

/** The Express app on the restored database and bucket, built as server/main.ts builds it. */
async function appOn(databaseUrl: string, bucket: string): Promise<{ client: () => ApiClient; close: () => Promise<void> }> {
  const config = loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', DATABASE_URL: databaseUrl, S3_BUCKET: bucket, STATIC_DIR: '/nonexistent' });
  const handle: DatabaseHandle = createDatabase(databaseUrl, { max: 4 });
  const jobs: JobQueue = createJobQueue(databaseUrl, { max: 2, policies: jobPolicies(config.media.timeoutMs) });
  await jobs.start();
  const storage = createObjectStorage(config);
  const ctx: AppContext = { config, db: handle.db, logger: createLogger('silent'), jobs, storage, now: () => new Date() };
  const app = createApp(ctx, handle.pool);
  return {
    client: () => new ApiClient(app),
    async close() {
      await jobs.stop();
      storage.destroy();
      await handle.close();
    },
  };
}

async function signedIn(client: ApiClient, email: string): Promise<ApiClient> {
  expect((await client.login(email, TEST_PASSWORD)).status).toBe(200);
  return client;
}

async function directoryBytes(dir: string): Promise<number> {
  let total = 0;
  for (const entry of await readdir(dir, { withFileTypes: true, recursive: true })) {
    if (entry.isFile()) total += (await stat(path.join(entry.parentPath, entry.name))).size;
  }
  return total;
}

beforeAll(async () => {
  const services = testServices();
  source = await startTestApp();
  team = await createTeamFixture(source.ctx.db, 'Drill');
  workDir = await mkdtemp(path.join(services.runDir, 'drill-'));
  backupDir = path.join(workDir, 'backup');

  // Film, snaps, a depth chart and grades from two graders, all through the API.
  const analyst = await signedIn(source.client(), team.accounts.analyst.email);
  const coach = await signedIn(source.client(), team.accounts.coach.email);
  const coordinator = await signedIn(source.client(), team.accounts.coordinator.email);
  sessionId = await createSession(analyst, team.teamId, { title: 'Week 6 vs Larkspur Ridge', opponent: 'Larkspur Ridge', week: 6 });
  const snapIds: number[] = [];
  for (let i = 0; i < 4; i += 1) {
    const snap = await analyst.post(`/api/film-sessions/${sessionId}/snaps`, {});
    expect(snap.status).toBe(201);
    snapIds.push(snap.body.id as number);
  }
  const [LT, LG, C] = team.playerIds as [number, number, number];
  expect((await coordinator.put(`/api/teams/${team.teamId}/depth-chart`, { positions: { LT: [LT], LG: [LG], C: [C] }, reason: 'drill' })).status).toBe(200);
  const plus = { assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', effort: 'plus' };
  const grades: [ApiClient, number, number, object][] = [
    [coach, snapIds[0]!, LT, plus],
    [coach, snapIds[1]!, LT, { ...plus, hands: 'minus', knockdowns: 1 }],
    [coach, snapIds[2]!, LT, { assignment: 'missed', missedReason: 'wrong call', hands: 'plus', padLevel: 'minus', effort: 'plus', note: 'Check the call.' }],
    [coach, snapIds[0]!, LG, plus],
    [coordinator, snapIds[0]!, LG, { ...plus, padLevel: 'minus' }],
    [coach, snapIds[1]!, C, { ...plus, pressuresAllowed: 1, penalties: [{ type: 'holding' }] }],
  ];
  for (const [client, snap, player, body] of grades) expect((await client.put(`/api/snaps/${snap}/grades/${player}`, body)).status).toBe(200);

  // A clip uploaded through the API (its original lands in the store and a job waits in the queue),
  // and objects put straight into the store: binary, empty, and a key that needs encoding on disk.
  const clipFile = await makeClip(workDir, { seconds: 1, audio: true, name: 'drill.mp4' });
  const upload = await analyst.upload(`/api/film-sessions/${sessionId}/clips`, [{ path: clipFile }], { angle: 'sideline' });
  expect(upload.status).toBe(201);
  clipId = upload.body.clips[0].id as number;
  const put = (key: string, body: Buffer, type: string) => source.ctx.storage.upload(key, body, type).done;
  await put(`teams/${team.teamId}/exports/noise.bin`, pseudoRandomBytes(1_500_000, 99), 'application/octet-stream');
  await put(`teams/${team.teamId}/exports/empty.txt`, Buffer.alloc(0), 'text/plain');
  await put(`teams/${team.teamId}/exports/Week 6 – notes ä.txt`, Buffer.from('Ironvale Anvils: pad level on the double team.\n'), 'text/plain; charset=utf-8');

  before.counts = await tableCounts(source.database.url);
  before.objects = await objectHashes(source.ctx.storage);
  before.reports = await gradeReports(coach);

  const admin = new pg.Client({ connectionString: services.databaseAdminUrl });
  await admin.connect();
  restored.database = `tw_drill_restore_${process.pid}_${randomBytes(3).toString('hex')}`;
  // A new, empty database (template0: nothing from trenchwork_test), as a replacement server would have.
  await admin.query(`CREATE DATABASE "${restored.database}" TEMPLATE template0`);
  await admin.end();
  const url = new URL(source.database.url);
  url.pathname = `/${restored.database}`;
  restored.url = url.toString();
}, 60_000);

afterAll(async () => {
  if (figures.length) console.log(`backup drill figures:\n  ${figures.join('\n  ')}`);
  await source?.close();
  if (restored.database) {
    const admin = new pg.Client({ connectionString: testServices().databaseAdminUrl });
    await admin.connect();
    await admin.query(`DROP DATABASE IF EXISTS "${restored.database}" WITH (FORCE)`);
    await admin.end();
  }
  if (workDir) await rm(workDir, { recursive: true, force: true });
});

test('backup writes the dump, every object and a manifest that describes them', async () => {
  const run = await runScript('backup', [backupDir], { databaseUrl: source.database.url, bucket: source.config.s3.bucket });
  expectSuccess(run);
  expect(run.stdout).toMatch(/Backup complete/);
  const manifest = JSON.parse(await readFile(path.join(backupDir, 'manifest.json'), 'utf8'));
  expect(manifest.database.tables).toEqual(before.counts);
  expect(manifest.database.migrations.length).toBeGreaterThan(0);
  expect(manifest.objects.count).toBe(Object.keys(before.objects!).length);
  expect(Object.fromEntries(manifest.objects.items.map((i: { key: string; sha256: string }) => [i.key, i.sha256]))).toEqual(before.objects);
  const odd = manifest.objects.items.find((i: { key: string }) => i.key.endsWith('notes ä.txt'));
  expect(odd.file).toBe(`objects/teams/${team.teamId}/exports/Week%206%20%E2%80%93%20notes%20%C3%A4.txt`);
  const size = await directoryBytes(backupDir);
  figures.push(`backup: ${run.ms} ms wall (child process), ${manifest.database.totalRows} rows, dump ${manifest.database.bytes} B, ${manifest.objects.count} objects ${manifest.objects.bytes} B, folder ${size} B`);
}, 30_000);

test('backup refuses a directory that is not empty, unless --force', async () => {
  const refused = await runScript('backup', [backupDir], { databaseUrl: source.database.url, bucket: source.config.s3.bucket });
  expect(refused.code).toBe(1);
  expect(refused.stderr).toMatch(/is not empty .*--force/);
  expect(await readFile(path.join(backupDir, 'manifest.json'), 'utf8')).toContain('"format": "trenchwork-backup"');
}, 30_000);

test('restore into a new database and a new bucket gives the same rows, objects and grade reports', async () => {
  const run = await runScript('restore', [backupDir], { databaseUrl: restored.url, bucket: restored.bucket });
  expectSuccess(run);
  expect(run.stdout).toMatch(/Restore complete .*all matching the manifest/);
  figures.push(`restore: ${run.ms} ms wall (child process), into an empty database and a new bucket`);

  expect(await tableCounts(restored.url)).toEqual(before.counts);
  const storage = createObjectStorage(loadConfig({ ...process.env, S3_BUCKET: restored.bucket }));
  try {
    expect(await objectHashes(storage)).toEqual(before.objects);
  } finally {
    storage.destroy();
  }
  const app = await appOn(restored.url, restored.bucket);
  try {
    const coach = await signedIn(app.client(), team.accounts.coach.email);
    expect(await gradeReports(coach)).toEqual(before.reports);
  } finally {
    await app.close();
  }
}, 30_000);

test('restore refuses a database that already holds Trenchwork tables, unless --force', async () => {
  const refused = await runScript('restore', [backupDir], { databaseUrl: restored.url, bucket: `${restored.bucket}-other` });
  expect(refused.code).toBe(1);
  expect(refused.stderr).toMatch(/already holds Trenchwork tables.*--force/s);
}, 30_000);

test('a damaged object file is found before anything changes; --force then replaces the restore', async () => {
  const manifest = JSON.parse(await readFile(path.join(backupDir, 'manifest.json'), 'utf8'));
  const noise = manifest.objects.items.find((i: { key: string }) => i.key.endsWith('noise.bin'));
  const file = path.join(backupDir, noise.file);
  const good = await readFile(file);
  const bad = Buffer.from(good);
  bad[1000] = bad[1000]! ^ 0xff;
  await writeFile(file, bad);
  // Mark the restored database so a change would show.
  const marker = new pg.Client({ connectionString: restored.url });
  await marker.connect();
  await marker.query(`insert into teams (name) values ('Written after the restore')`);
  const rejected = await runScript('restore', [backupDir, '--force'], { databaseUrl: restored.url, bucket: restored.bucket });
  expect(rejected.code).toBe(1);
  expect(rejected.stderr).toContain(`${noise.key}: ${good.length} bytes, SHA-256`);
  expect(rejected.stderr).toMatch(/nothing was changed/);
  expect(Number((await marker.query(`select count(*) as n from teams where name = 'Written after the restore'`)).rows[0].n)).toBe(1);
  await marker.end();

  await writeFile(file, good);
  const forced = await runScript('restore', [backupDir, '--force'], { databaseUrl: restored.url, bucket: restored.bucket });
  expectSuccess(forced);
  expect(forced.stdout).toMatch(/--force: dropping schemas public, pgboss|--force: dropping schemas pgboss, public/);
  expect(await tableCounts(restored.url)).toEqual(before.counts);
  figures.push(`restore --force over the restored copy: ${forced.ms} ms wall`);
}, 30_000);

describe('object keys become paths inside objects/ only', () => {
  test('server-made keys keep their shape', () => {
    expect(objectFileFor('teams/1/clips/2/web.mp4')).toBe('objects/teams/1/clips/2/web.mp4');
    expect(objectFileFor('teams/1/sessions/3/originals/0b7c-4d2e')).toBe('objects/teams/1/sessions/3/originals/0b7c-4d2e');
  });

  test('traversal, absolute keys, dot files, empty segments and odd bytes are encoded', () => {
    expect(objectFileFor('../../etc/passwd')).toBe('objects/%2E./%2E./etc/passwd');
    expect(objectFileFor('/etc/passwd')).toBe('objects/%/etc/passwd');
    expect(objectFileFor('a/./b')).toBe('objects/a/%2E/b');
    expect(objectFileFor('.hidden')).toBe('objects/%2Ehidden');
    expect(objectFileFor('folder/')).toBe('objects/folder/%');
    expect(objectFileFor('a\\..\\b')).toBe('objects/a%5C..%5Cb');
    expect(objectFileFor('nul\u0000byte')).toBe('objects/nul%00byte');
    for (const key of ['../x', '..', 'a/../../b', '/', '//', '.', '...']) {
      const file = objectFileFor(key);
      expect(file.startsWith('objects/')).toBe(true);
      expect(path.posix.normalize(file).startsWith('objects/')).toBe(true);
      expect(file.split('/').slice(1).some((s) => s === '..' || s === '.' || s === '')).toBe(false);
    }
  });

  test('keys too long or too deep for a file system go to .by-hash', () => {
    expect(objectFileFor('x'.repeat(300))).toBe(hashedObjectFileFor('x'.repeat(300)));
    expect(objectFileFor(Array(40).fill('d').join('/'))).toMatch(/^objects\/\.by-hash\/[0-9a-f]{64}$/);
  });

  test('restore refuses manifest entries that point outside objects/ or through a link', async () => {
    const dir = await mkdtemp(path.join(workDir, 'paths-'));
    await writeFile(path.join(dir, 'secret.txt'), 'not an object');
    const { mkdir, symlink } = await import('node:fs/promises');
    await mkdir(path.join(dir, 'objects'));
    await writeFile(path.join(dir, 'objects', 'fine.bin'), 'ok');
    await symlink(path.join(dir, 'secret.txt'), path.join(dir, 'objects', 'link.bin'));
    await expect(resolveObjectFile(dir, 'objects/fine.bin')).resolves.toBe(path.join(dir, 'objects', 'fine.bin'));
    await expect(resolveObjectFile(dir, 'objects/../secret.txt')).rejects.toThrow(/outside objects/);
    await expect(resolveObjectFile(dir, '/etc/passwd')).rejects.toThrow(/not a relative path/);
    await expect(resolveObjectFile(dir, 'objects/link.bin')).rejects.toThrow(/link to outside/);
    await expect(resolveObjectFile(dir, 'objects')).rejects.toThrow(/outside objects/);
  });
});

test('a backup taken while the app writes is consistent: its counts match what its dump restores', async () => {
  const liveDir = path.join(workDir, 'live');
  const writer = new pg.Client({ connectionString: source.database.url });
  await writer.connect();
  let writing = true;
  let written = 0;
  const writes = (async () => {
    while (writing) {
      await writer.query(`insert into teams (name) values ($1)`, [`Live ${written}`]);
      written += 1;
    }
  })();
  const run = await runScript('backup', [liveDir], { databaseUrl: source.database.url, bucket: source.config.s3.bucket });
  writing = false;
  await writes;
  await writer.end();
  expectSuccess(run);
  const manifest = JSON.parse(await readFile(path.join(liveDir, 'manifest.json'), 'utf8'));
  const teamsInBackup = manifest.database.tables['public.teams'] as number;
  // Rows kept arriving during the whole run; the snapshot took some of them, not all.
  expect(written).toBeGreaterThan(0);
  expect(teamsInBackup).toBeGreaterThanOrEqual(before.counts!['public.teams']!);
  expect(teamsInBackup).toBeLessThan(before.counts!['public.teams']! + written);
  const forced = await runScript('restore', [liveDir, '--force'], { databaseUrl: restored.url, bucket: restored.bucket });
  expectSuccess(forced);
  expect((await tableCounts(restored.url))['public.teams']).toBe(teamsInBackup);
  figures.push(`backup under write load: ${written} rows inserted during the run, ${teamsInBackup - before.counts!['public.teams']!} of them in the snapshot`);
}, 30_000);
