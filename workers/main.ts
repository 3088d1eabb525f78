import { loadConfig } from '../server/core/config';
import { createLogger } from '../server/core/logger';
import { createJobQueue } from '../server/core/queue';
import { createMailer } from './mailer';
import { startWorking } from './worker';

// The background worker process: `npm run serve:worker`. pg-boss gives at-least-once delivery with
// per-type retries; SIGTERM lets running jobs finish before exit.
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger(config.logLevel).child({ process: 'worker' });
  const queue = createJobQueue(config.databaseUrl, { supervise: true, max: config.workerConcurrency + 2 });
  await queue.start();
  const mailer = createMailer(config);
  await startWorking(queue, { logger, mailer }, config.workerConcurrency);
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
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
