import type PgBoss from 'pg-boss';
import { JOB_NAMES, type JobName, type JobPayloads } from '../server/core/jobs';
import type { JobQueue } from '../server/core/queue';
import { HANDLERS, type WorkerDeps } from './handlers';

/**
 * Subscribes a handler to every job type. Fails at start if a type has no handler (a safety net
 * beside the compile-time check). Errors thrown by a handler make pg-boss retry with the type's policy.
 */
export async function startWorking(queue: JobQueue, deps: WorkerDeps, concurrency: number): Promise<void> {
  for (const name of JOB_NAMES) {
    const handler = HANDLERS[name];
    if (typeof handler !== 'function') throw new Error(`No handler for job type ${name}`);
    for (let i = 0; i < concurrency; i += 1) {
      await queue.boss.work<JobPayloads[JobName]>(name, { batchSize: 1, pollingIntervalSeconds: 1 }, async (jobs: PgBoss.Job<JobPayloads[JobName]>[]) => {
        for (const job of jobs) {
          try {
            await (handler as (d: WorkerDeps, data: unknown, id: string) => Promise<void>)(deps, job.data, job.id);
          } catch (error) {
            deps.logger.warn({ event: 'job_failed_attempt', job: name, jobId: job.id, err: error }, 'job attempt failed');
            throw error;
          }
        }
      });
    }
  }
}
