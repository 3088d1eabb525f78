import type { Database } from '../db/database';
import type { Config } from '../server/core/config';
import type { JobName, JobPayloads } from '../server/core/jobs';
import type { Logger } from '../server/core/logger';
import type { JobQueue } from '../server/core/queue';
import type { ObjectStorage } from '../server/core/storage';
import { clipJobDead } from './clip-dead.handler';
import { sendCoachingDigest } from './coaching-digest.handler';
import { enqueueWeeklySummaries, sendWeeklySummaries } from './weekly-summary.handler';
import type { Mailer } from './mailer';
import type { MediaOps } from './media-ops';
import { processClip } from './process-clip.handler';
import { sendMail } from './send-mail.handler';
import { detectTapeCuts } from './tape-detect.handler';
import { splitTape } from './tape-split.handler';

export interface WorkerDeps {
  config: Config;
  logger: Logger;
  db: Database;
  storage: ObjectStorage;
  jobs: JobQueue;
  mailer: Mailer;
  media: MediaOps;
}

export type JobHandler<N extends JobName> = (deps: WorkerDeps, data: JobPayloads[N], jobId: string) => Promise<void>;

/** Exactly one handler per job type; the mapped type makes a missing handler a compile error. */
export const HANDLERS: { [N in JobName]: JobHandler<N> } = {
  'mail.send': sendMail,
  'clip.process': processClip,
  'tape.detect': detectTapeCuts,
  'tape.split': splitTape,
  'clip.dead': clipJobDead,
  'digest.coaching': sendCoachingDigest,
  'summary.weekly': sendWeeklySummaries,
  'summary.weekly-all': enqueueWeeklySummaries,
};
