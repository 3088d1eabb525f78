import type { JobName, JobPayloads } from '../server/core/jobs';
import type { Logger } from '../server/core/logger';
import type { Mailer } from './mailer';
import { sendMail } from './send-mail.handler';

export interface WorkerDeps {
  logger: Logger;
  mailer: Mailer;
}

export type JobHandler<N extends JobName> = (deps: WorkerDeps, data: JobPayloads[N], jobId: string) => Promise<void>;

/** Exactly one handler per job type; the mapped type makes a missing handler a compile error. */
export const HANDLERS: { [N in JobName]: JobHandler<N> } = {
  'mail.send': sendMail,
};
