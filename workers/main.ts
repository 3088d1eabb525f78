import { createDatabase } from '../db/database';
import { loadConfig } from '../server/core/config';
import { jobPolicies } from '../server/core/jobs';
import { createLogger } from '../server/core/logger';
import { createJobQueue } from '../server/core/queue';
import { createObjectStorage } from '../server/core/storage';
import { createMailer } from './mailer';
import { createMediaOps } from './media-toolkit';
import { registerSchedules } from './schedules';
import { startWorking } from './worker';

// The background worker process: `npm run serve:worker`. pg-boss gives at-least-once delivery with
// per-type retries; SIGTERM lets running jobs finish before exit.
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger(config.logLevel).child({ process: 'worker' });
  const queue = createJobQueue(config.databaseUrl, {
    supervise: true,
    max: config.workerConcurrency + 2,
    policies: jobPolicies(config.media.timeoutMs),
    maintenanceSeconds: config.jobMaintenanceSeconds,
    schedule: true,
  });
  await queue.start();
  await registerSchedules(queue, config);
  const database = createDatabase(config.databaseUrl, { max: config.workerConcurrency + 2 });
  const storage = createObjectStorage(config);
  const mailer = createMailer(config);
  const media = createMediaOps(config);
  await startWorking(queue, { config, logger, db: database.db, storage, jobs: queue, mailer, media }, config.workerConcurrency);
  logger.info({ concurrency: config.workerConcurrency }, 'worker started');

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'worker stopping');
    const force = setTimeout(() => process.exit(1), 20_000);
    force.unref();
    await queue.stop().catch(() => undefined);
    mailer.close();
    storage.destroy();
    await database.close().catch(() => undefined);
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
