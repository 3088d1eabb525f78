import type { Config } from './config';
import type { Database } from '../../db/database';
import type { Logger } from './logger';
import type { JobQueue } from './queue';
import type { ObjectStorage } from './storage';

/** What every service function receives: the process's configured parts. Built once in main.ts. */
export interface AppContext {
  config: Config;
  db: Database;
  logger: Logger;
  jobs: JobQueue;
  storage: ObjectStorage;
  /** The clock, injectable so tests can move time (token expiry, session timeouts). */
  now: () => Date;
}
