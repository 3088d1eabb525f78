import { sql } from 'kysely';
import type { AppContext } from '../core/context';
import { JOB_NAMES } from '../core/jobs';

/**
 * Whether this process can serve traffic: the database answers, the job queue's schema (pgboss) is
 * installed with a queue for every job type, and the bucket can be listed. Each check has its own
 * time limit, so a hung store makes the probe answer "not ready" instead of hanging the probe.
 */
export type CheckState = 'ok' | 'missing' | 'unavailable';
export interface Readiness {
  ready: boolean;
  checks: { database: CheckState; jobQueue: CheckState; objectStore: CheckState };
}

const CHECK_TIMEOUT_MS = 3000;
// A prefix no key uses: listing it proves the bucket exists and answers without walking its objects.
const PROBE_PREFIX = '.trenchwork-readiness/';

class CheckTimeout extends Error {}

function withinTime<T>(work: Promise<T>): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_resolve, reject) => {
    timer = setTimeout(() => reject(new CheckTimeout(`no answer within ${CHECK_TIMEOUT_MS} ms`)), CHECK_TIMEOUT_MS);
  });
  return Promise.race([work, timeout]).finally(() => clearTimeout(timer));
}

async function checkDatabase(app: AppContext): Promise<CheckState> {
  await sql`select 1`.execute(app.db);
  return 'ok';
}

async function checkJobQueue(app: AppContext): Promise<CheckState> {
  const { rows } = await sql<{ installed: boolean }>`
    select to_regclass('pgboss.version') is not null and to_regclass('pgboss.queue') is not null as installed`.execute(app.db);
  if (!rows[0]?.installed) return 'missing';
  const queues = await sql<{ n: number }>`select count(*)::int as n from pgboss.queue where name in (${sql.join(JOB_NAMES)})`.execute(app.db);
  return queues.rows[0]?.n === JOB_NAMES.length ? 'ok' : 'missing';
}

async function checkObjectStore(app: AppContext): Promise<CheckState> {
  try {
    await app.storage.list(PROBE_PREFIX);
    return 'ok';
  } catch (error) {
    if ((error as { name?: string }).name === 'NoSuchBucket') return 'missing';
    throw error;
  }
}

export async function checkReadiness(app: AppContext): Promise<Readiness> {
  const run = async (part: keyof Readiness['checks'], check: (app: AppContext) => Promise<CheckState>): Promise<CheckState> => {
    try {
      const state = await withinTime(check(app));
      if (state !== 'ok') app.logger.warn({ event: 'readiness_failed', part, state }, 'not ready');
      return state;
    } catch (error) {
      app.logger.warn({ event: 'readiness_failed', part, state: 'unavailable', err: error }, 'not ready');
      return 'unavailable';
    }
  };
  const [database, jobQueue, objectStore] = await Promise.all([run('database', checkDatabase), run('jobQueue', checkJobQueue), run('objectStore', checkObjectStore)]);
  const checks = { database, jobQueue, objectStore };
  return { ready: database === 'ok' && jobQueue === 'ok' && objectStore === 'ok', checks };
}
