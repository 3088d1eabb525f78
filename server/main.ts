import { createServer } from 'node:http';
import { createDatabase } from '../db/database';
import { loadConfig } from './core/config';
import type { AppContext } from './core/context';
import { createLogger } from './core/logger';
import { jobPolicies } from './core/jobs';
import { createJobQueue } from './core/queue';
import { createObjectStorage } from './core/storage';
import { createApp } from './app';

// The API process: `npm run serve:api`. Stops gracefully on SIGTERM / SIGINT.
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  const database = createDatabase(config.databaseUrl, { max: config.databasePoolMax });
  const jobs = createJobQueue(config.databaseUrl, { policies: jobPolicies(config.media.timeoutMs) });
  await jobs.start();
  const storage = createObjectStorage(config);
  await storage.ensureBucket().catch((error: unknown) => logger.warn({ err: error }, 'object storage not reachable at start; uploads will fail until it is'));
  const ctx: AppContext = { config, db: database.db, logger, jobs, storage, now: () => new Date() };
  const server = createServer(createApp(ctx, database.pool));
  server.keepAliveTimeout = 65_000;
  await new Promise<void>((resolve) => server.listen(config.port, config.host, resolve));
  logger.info({ url: config.publicUrl, port: config.port }, 'Trenchwork API listening');

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'shutting down');
    const force = setTimeout(() => process.exit(1), 15_000);
    force.unref();
    server.close();
    server.closeIdleConnections();
    await jobs.stop().catch(() => undefined);
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
