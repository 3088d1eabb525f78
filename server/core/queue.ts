import { CompiledQuery, type Kysely } from 'kysely';
import PgBoss from 'pg-boss';
import { JOB_NAMES, JOB_POLICIES, type JobName, type JobPayloads, type JobPolicy } from './jobs';

/**
 * The PostgreSQL-backed job queue (pg-boss). `send` can take a Kysely transaction so that a job is
 * enqueued in the same transaction as the row it is about: both land, or neither.
 */
export interface JobQueue {
  readonly boss: PgBoss;
  start(): Promise<void>;
  stop(): Promise<void>;
  send<N extends JobName>(name: N, data: JobPayloads[N], trx?: Kysely<any>, options?: SendTiming): Promise<string | null>;
}

/** When a job may run, and at most one per key per time slot (pg-boss throttling). */
export interface SendTiming {
  startAfterSeconds?: number;
  singletonKey?: string;
  singletonSeconds?: number;
  /** A send in a slot already used is queued for the next slot instead of dropped. */
  singletonNextSlot?: boolean;
}

export interface QueueOptions {
  supervise?: boolean;
  max?: number;
  policies?: { readonly [N in JobName]: JobPolicy };
  maintenanceSeconds?: number;
  /** Run pg-boss's cron scheduler in this process (the workers do; every instance may, pg-boss sends each tick once). */
  schedule?: boolean;
}

/**
 * Creates or updates one queue. Several processes starting at once (API replicas, workers) race
 * here: a deadlock or a duplicate from the other process is retried, and then the queue exists.
 */
async function ensureQueue(boss: PgBoss, queue: PgBoss.Queue): Promise<void> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      if (await boss.getQueue(queue.name)) await boss.updateQueue(queue.name, queue);
      else await boss.createQueue(queue.name, queue);
      return;
    } catch (error) {
      const code = (error as { code?: string }).code;
      if (attempt >= 5 || (code !== '40P01' && code !== '23505' && code !== '40001')) throw error;
      await new Promise((resolve) => setTimeout(resolve, 50 + Math.random() * 200 * attempt));
    }
  }
}

export function createJobQueue(connectionString: string, options: QueueOptions = {}): JobQueue {
  const policies = options.policies ?? JOB_POLICIES;
  const boss = new PgBoss({
    connectionString,
    schema: 'pgboss',
    max: options.max ?? 4,
    supervise: options.supervise ?? false,
    schedule: options.schedule ?? false,
    ...(options.maintenanceSeconds ? { maintenanceIntervalSeconds: options.maintenanceSeconds, monitorStateIntervalSeconds: Math.max(1, options.maintenanceSeconds) } : {}),
  });
  // A lost connection is reported here; pg-boss reconnects by itself.
  boss.on('error', () => undefined);
  let started = false;
  return {
    boss,
    async start() {
      if (started) return;
      await boss.start();
      // Dead-letter queues first: a queue can only name one that exists.
      const ordered = [...JOB_NAMES].sort((a, b) => Number(Boolean(policies[a].deadLetter)) - Number(Boolean(policies[b].deadLetter)));
      for (const name of ordered) await ensureQueue(boss, { name, ...policies[name] });
      started = true;
    },
    async stop() {
      if (!started) return;
      started = false;
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
    send(name, data, trx, timing = {}) {
      const db = trx
        ? { executeSql: async (text: string, values: unknown[]) => trx.executeQuery(CompiledQuery.raw(text, values)) as Promise<{ rows: any[] }> }
        : undefined;
      const { deadLetter: _deadLetter, ...policy } = policies[name];
      return boss.send(name, data as object, {
        ...policy,
        db,
        ...(timing.startAfterSeconds ? { startAfter: timing.startAfterSeconds } : {}),
        ...(timing.singletonKey ? { singletonKey: timing.singletonKey } : {}),
        ...(timing.singletonSeconds ? { singletonSeconds: timing.singletonSeconds } : {}),
        ...(timing.singletonNextSlot ? { singletonNextSlot: true } : {}),
      });
    },
  };
}
