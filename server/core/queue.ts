import { CompiledQuery, type Kysely } from 'kysely';
import PgBoss from 'pg-boss';
import { JOB_NAMES, JOB_POLICIES, type JobName, type JobPayloads } from './jobs';

/**
 * The PostgreSQL-backed job queue (pg-boss). `send` can take a Kysely transaction so that a job is
 * enqueued in the same transaction as the row it is about: both land, or neither.
 */
export interface JobQueue {
  readonly boss: PgBoss;
  start(): Promise<void>;
  stop(): Promise<void>;
  send<N extends JobName>(name: N, data: JobPayloads[N], trx?: Kysely<any>): Promise<string | null>;
}

export function createJobQueue(connectionString: string, options: { supervise?: boolean; max?: number } = {}): JobQueue {
  const boss = new PgBoss({
    connectionString,
    schema: 'pgboss',
    max: options.max ?? 4,
    supervise: options.supervise ?? false,
    schedule: false,
  });
  // A lost connection is reported here; pg-boss reconnects by itself.
  boss.on('error', () => undefined);
  let started = false;
  return {
    boss,
    async start() {
      if (started) return;
      await boss.start();
      for (const name of JOB_NAMES) {
        if (!(await boss.getQueue(name))) await boss.createQueue(name, { name, ...JOB_POLICIES[name] });
      }
      started = true;
    },
    async stop() {
      if (!started) return;
      started = false;
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
    send(name, data, trx) {
      const db = trx
        ? { executeSql: async (text: string, values: unknown[]) => trx.executeQuery(CompiledQuery.raw(text, values)) as Promise<{ rows: any[] }> }
        : undefined;
      return boss.send(name, data as object, { ...JOB_POLICIES[name], db });
    },
  };
}
