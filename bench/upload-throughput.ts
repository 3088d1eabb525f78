/**
 * Upload throughput through the API vs a direct upload to the same S3 store, and the server's
 * memory while a large upload streams through it (issue 3).
 *
 *   node --import tsx bench/upload-throughput.ts [--quick]
 *
 * The real server runs as its own process (`node --import tsx server/main.ts`) against a fresh
 * PostgreSQL cluster and the S3 fake (scripts/s3-fake.ts), all on 127.0.0.1. The same file goes
 *   api:    POST /api/film-sessions/{id}/clips, multipart streamed from disk by node:http
 *           (multer → content check → SHA-256 → lib-storage Upload, server/film/upload-engine.ts)
 *   direct: lib-storage Upload from this process, through server/core/storage.ts itself, so part
 *           size (8 MiB) and queue size (2) are the server's
 *   put:    one PutObject of the whole file streamed with its length (the issue's named baseline)
 * rotating which goes first in each round. While each API upload runs, the server's VmRSS is
 * read every 100 ms; growth = peak − the reading just before the upload.
 */
import { randomBytes } from 'node:crypto';
import { createReadStream, statSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import type { UploadResponse } from '@shared/api/film';
import { createDatabase, type Database } from '../db/database';
import { loadConfig } from '../server/core/config';
import { PutObjectCommand, type S3Client } from '@aws-sdk/client-s3';
import { createObjectStorage, createS3Client, type ObjectStorage } from '../server/core/storage';
import { createTeamFixture, TEST_PASSWORD } from '../test/support/fixtures';
import { ApiSession } from './lib/api-session';
import { ratioOf, type BenchOptions, type BenchResult } from './lib/bench-result';
import { progress, runCli } from './lib/bench-cli';
import { withBenchStack, type BenchStack } from './lib/bench-stack';
import { makeUploadFile } from './lib/media-samples';
import { cpuDuring } from './lib/process-cpu';
import { RssSampler } from './lib/rss-sampler';
import { median, MiB, timed } from './lib/stats';

const GiB = 1024 * MiB;
// Large enough for lib-storage to take the multipart path, as the measured uploads do.
const WARM_UP_BYTES = 20 * MiB;

interface ApiRound {
  mibPerSecond: number;
  cpu: Record<string, number>;
  rssBefore: number;
  rssMax: number;
  samples: number;
}

export async function run(options: BenchOptions): Promise<BenchResult[]> {
  const bytes = options.quick ? 128 * MiB : 1 * GiB;
  const rounds = 3;
  return withBenchStack((stack) => measure(stack, bytes, rounds), { serverEnv: { MAX_UPLOAD_BYTES: String(bytes + 64 * MiB) } });
}

async function measure(stack: BenchStack, bytes: number, rounds: number): Promise<BenchResult[]> {
  progress(`writing a ${bytes / MiB} MiB upload file`);
  const file = await makeUploadFile(stack.runDir, bytes);
  const warmUpFile = await makeUploadFile(stack.runDir, WARM_UP_BYTES);
  const database = createDatabase(stack.databaseUrl, { max: 2 });
  const s3Client = createS3Client(loadConfig(stack.env));
  const storage = createObjectStorage(loadConfig(stack.env), s3Client);
  try {
    const team = await createTeamFixture(database.db, 'Bench');
    const api = new ApiSession(stack.appUrl);
    await api.signIn(team.accounts.admin.email, TEST_PASSWORD);
    const newSession = async (title: string) =>
      (await api.json<{ id: number }>('POST', '/api/film-sessions', { teamId: team.teamId, kind: 'practice', title, date: '2026-08-20' }, 201)).id;

    // First requests load code and fill pools in both processes; not measured.
    progress('warm-up uploads');
    await apiUpload(api, database.db, storage, await newSession('Warm-up'), warmUpFile);
    await directUpload(storage, warmUpFile);
    await putObjectUpload(s3Client, storage, warmUpFile);

    const apiRounds: ApiRound[] = [];
    const direct: number[] = [];
    const directCpu: Record<string, number>[] = [];
    const put: number[] = [];
    const pids = { bench: process.pid, server: stack.serverPid, s3: stack.s3Pid };
    const ways = ['api', 'direct', 'put'] as const;
    for (let round = 1; round <= rounds; round++) {
      // Each round starts with another way, so no way always runs on a warmer (or busier) machine.
      for (const way of [...ways.slice((round - 1) % ways.length), ...ways.slice(0, (round - 1) % ways.length)]) {
        if (way === 'put') {
          const ms = await putObjectUpload(s3Client, storage, file);
          put.push(bytes / MiB / (ms / 1000));
          progress(`round ${round} PutObject: ${(ms / 1000).toFixed(2)} s, ${put.at(-1)!.toFixed(1)} MiB/s`);
        } else if (way === 'direct') {
          const { result: ms, cpu } = await cpuDuring({ bench: pids.bench, s3: pids.s3 }, () => directUpload(storage, file));
          directCpu.push(cpu);
          direct.push(bytes / MiB / (ms / 1000));
          progress(`round ${round} direct: ${(ms / 1000).toFixed(2)} s, ${direct.at(-1)!.toFixed(1)} MiB/s`);
        } else {
          // A new session each time: the same file twice in one session is skipped as a duplicate.
          const sessionId = await newSession(`Upload round ${round}`);
          const sampler = new RssSampler(stack.serverPid, 100);
          const { result: ms, cpu } = await cpuDuring(pids, () => apiUpload(api, database.db, storage, sessionId, file));
          const rss = sampler.stop();
          apiRounds.push({ mibPerSecond: bytes / MiB / (ms / 1000), cpu, rssBefore: rss.before, rssMax: rss.max, samples: rss.samples });
          progress(`round ${round} api: ${(ms / 1000).toFixed(2)} s, ${apiRounds.at(-1)!.mibPerSecond.toFixed(1)} MiB/s, RSS ${mib(rss.before)} → peak ${mib(rss.max)} MiB`);
        }
      }
    }

    const apiMedian = median(apiRounds.map((r) => r.mibPerSecond));
    const directMedian = median(direct);
    const putMedian = median(put);
    const worst = apiRounds.reduce((a, b) => (b.rssMax - b.rssBefore > a.rssMax - a.rssBefore ? b : a));
    const size = bytes >= GiB ? `${bytes / GiB} GiB` : `${bytes / MiB} MiB`;
    const list = (values: number[]) => values.map((v) => v.toFixed(1)).join(', ');
    return [
      {
        name: `upload ${size} via API (multipart) vs direct PutObject`,
        value: apiMedian,
        unit: 'MiB/s',
        baseline: putMedian,
        ratio: ratioOf(apiMedian, putMedian),
        goal: '>= 0.8',
        note: `ratio = api/PutObject (one request, the file streamed with its length, from this process); median of ${rounds} round(s) each; PutObject ${list(put)} MiB/s`,
      },
      {
        name: `upload ${size} via API (multipart) vs direct S3 Upload`,
        value: apiMedian,
        unit: 'MiB/s',
        baseline: directMedian,
        ratio: ratioOf(apiMedian, directMedian),
        goal: '>= 0.8',
        note: `ratio = api/direct; median of ${rounds} round(s) each, order alternated; api ${list(apiRounds.map((r) => r.mibPerSecond))}, direct ${list(direct)} MiB/s`,
      },
      {
        name: `CPU seconds per ${size} upload: API vs direct`,
        value: sumOf(meanCpu(apiRounds.map((r) => r.cpu))),
        unit: 's',
        baseline: sumOf(meanCpu(directCpu)),
        ratio: ratioOf(sumOf(meanCpu(apiRounds.map((r) => r.cpu))), sumOf(meanCpu(directCpu))),
        note: `all processes, mean per upload; api: ${describeCpu(meanCpu(apiRounds.map((r) => r.cpu)))}; direct: ${describeCpu(meanCpu(directCpu))} (the bench reads the file and sends it both ways; ${availableParallelism()} cores)`,
      },
      {
        name: `server RSS growth during a ${size} upload`,
        value: (worst.rssMax - worst.rssBefore) / MiB,
        unit: 'MiB',
        goal: '< 64',
        note: `largest over ${rounds} upload(s) (each: ${apiRounds.map((r) => mib(r.rssMax - r.rssBefore)).join(', ')} MiB): VmRSS ${mib(worst.rssBefore)} MiB before, peak ${mib(worst.rssMax)} MiB (${worst.samples} samples, every 100 ms)`,
      },
    ];
  } finally {
    storage.destroy();
    await database.close();
  }
}

/** The API way, timed until the answer; then checks that the object landed whole (a fast broken upload must not count). */
async function apiUpload(api: ApiSession, db: Database, storage: ObjectStorage, sessionId: number, file: string): Promise<number> {
  const { ms, result } = await timed(() => api.uploadFile(`/api/film-sessions/${sessionId}/clips`, file));
  const body = result.body as UploadResponse;
  const clip = body?.clips?.[0];
  if (result.status !== 201 || !clip || clip.status === 'failed') throw new Error(`upload answered ${result.status}: ${JSON.stringify(result.body).slice(0, 500)}`);
  const row = await db.selectFrom('clips').select(['original_key', 'size_bytes']).where('id', '=', clip.id).executeTakeFirstOrThrow();
  await expectStored(storage, row.original_key, statSync(file).size, `clip ${clip.id}`);
  if (row.size_bytes !== statSync(file).size) throw new Error(`clip ${clip.id} recorded ${row.size_bytes} bytes, the file has ${statSync(file).size}`);
  return ms;
}

async function directUpload(storage: ObjectStorage, file: string): Promise<number> {
  const key = `bench/direct/${randomBytes(8).toString('hex')}`;
  const { ms } = await timed(() => storage.upload(key, createReadStream(file), 'application/octet-stream').done);
  await expectStored(storage, key, statSync(file).size, key);
  await storage.remove([key]);
  return ms;
}

/** The issue's named baseline: one PutObject of the whole file, streamed with its length. */
async function putObjectUpload(client: S3Client, storage: ObjectStorage, file: string): Promise<number> {
  const key = `bench/put/${randomBytes(8).toString('hex')}`;
  const size = statSync(file).size;
  const { ms } = await timed(() => client.send(new PutObjectCommand({ Bucket: storage.bucket, Key: key, Body: createReadStream(file), ContentLength: size, ContentType: 'application/octet-stream' })));
  await expectStored(storage, key, size, key);
  await storage.remove([key]);
  return ms;
}

async function expectStored(storage: ObjectStorage, key: string | null, size: number, what: string): Promise<void> {
  const head = key ? await storage.head(key) : null;
  if (!head || head.size !== size) throw new Error(`${what}: stored ${head ? `${head.size} bytes` : 'nothing'}, expected ${size}`);
}

function meanCpu(rounds: Record<string, number>[]): Record<string, number> {
  const names = Object.keys(rounds[0] ?? {});
  return Object.fromEntries(names.map((n) => [n, rounds.reduce((sum, r) => sum + r[n]!, 0) / rounds.length]));
}

function sumOf(cpu: Record<string, number>): number {
  return Object.values(cpu).reduce((a, b) => a + b, 0);
}

function describeCpu(cpu: Record<string, number>): string {
  return Object.entries(cpu).map(([name, s]) => `${name} ${s.toFixed(1)} s`).join(', ');
}

function mib(bytes: number): string {
  return (bytes / MiB).toFixed(0);
}

if (require.main === module) runCli('upload-throughput', run);
