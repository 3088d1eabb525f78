import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/core/config';
import type { AppContext } from '../../server/core/context';
import { createLogger } from '../../server/core/logger';
import { createJobQueue, type JobQueue } from '../../server/core/queue';
import { createObjectStorage } from '../../server/core/storage';
import { createMailer } from '../../workers/mailer';
import { createMediaOps } from '../../workers/media-toolkit';
import { startWorking } from '../../workers/worker';
import { jobPolicies } from '../../server/core/jobs';
import { ApiClient } from './api-client';
import { createTestDatabase, type TestDatabase } from './test-database';

export interface TestApp {
  app: Express;
  ctx: AppContext;
  config: Config;
  database: TestDatabase;
  jobs: JobQueue;
  /** Moves the app's clock (token expiry, session timeouts). */
  clock: { offsetMs: number };
  client(): ApiClient;
  /** Runs the background worker in this process (mail goes to the SMTP fake). */
  startWorker(): Promise<void>;
  close(): Promise<void>;
}

/** The real API on its own cloned database, with the real queue; mail goes to the SMTP fake. */
export async function startTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  // Each test app gets its own bucket: ids restart in every cloned database, so object keys would collide.
  const bucket = `tw-test-${randomBytes(5).toString('hex')}`;
  const config = loadConfig({
    ...process.env,
    S3_BUCKET: bucket,
    NODE_ENV: 'test',
    LOG_LEVEL: process.env.TEST_LOG_LEVEL ?? 'silent',
    DATABASE_URL: database.url,
    STATIC_DIR: env.STATIC_DIR ?? '/nonexistent',
    ...env,
  });
  const logger = createLogger(config.logLevel);
  const policies = jobPolicies(config.media.timeoutMs);
  const jobs = createJobQueue(database.url, { max: 3, policies });
  await jobs.start();
  const clock = { offsetMs: 0 };
  const storage = createObjectStorage(config);
  if (config.s3.endpoint) await storage.ensureBucket();
  const ctx: AppContext = { config, db: database.handle.db, logger, jobs, storage, now: () => new Date(Date.now() + clock.offsetMs) };
  const app = createApp(ctx, database.handle.pool);
  let workerQueue: JobQueue | undefined;
  let mailer: ReturnType<typeof createMailer> | undefined;
  return {
    app,
    ctx,
    config,
    database,
    jobs,
    clock,
    client: () => new ApiClient(app),
    async startWorker() {
      workerQueue = createJobQueue(database.url, { max: 4, policies, supervise: true, maintenanceSeconds: config.jobMaintenanceSeconds });
      await workerQueue.start();
      mailer = createMailer(config);
      await startWorking(workerQueue, { config, logger, db: database.handle.db, storage, jobs: workerQueue, mailer, media: createMediaOps(config) }, 1);
    },
    async close() {
      await workerQueue?.stop();
      mailer?.close();
      await jobs.stop();
      storage.destroy();
      await database.drop();
    },
  };
}
