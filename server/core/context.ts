import type { Config } from './config';
import type { Database } from '../../db/database';
import type { Logger } from './logger';
import type { JobQueue } from './queue';

/** What every service function receives: the process's configured parts. Built once in main.ts. */
export interface AppContext {
  config: Config;
  db: Database;
  logger: Logger;
  jobs: JobQueue;
  /** The clock, injectable so tests can move time (token expiry, session timeouts). */
  now: () => Date;
}
