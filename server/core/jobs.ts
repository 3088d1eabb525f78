/**
 * Every background job type, its payload and its retry policy, in one table. workers/handlers.ts maps
 * each type to exactly one handler and the compiler checks that none is missing.
 */
export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** Why the mail is sent (invitation, password_reset…): logged, never shown. */
  purpose: string;
}

/** A mail job as stored in the queue: the message sealed (see sealed.ts), the purpose in clear for logs. */
export interface SealedMail {
  sealed: string;
  purpose: string;
}

export interface JobPayloads {
  'mail.send': SealedMail;
  /** Probe, poster, scrub strip and web rendition of one uploaded clip (tapes also get proposed cuts). */
  'clip.process': { clipId: number };
  /** Re-run scene detection on a tape with another threshold. */
  'tape.detect': { clipId: number; threshold: number };
  /** Cut a tape into per-snap clips at the confirmed cut points. */
  'tape.split': { clipId: number; cutsMs: number[] };
  /** A clip job that used up its attempts: mark the clip failed with the reason. */
  'clip.dead': { clipId: number };
  /** One mail with a player's new coaching points (at most one per player per hour). */
  'digest.coaching': { playerId: number };
  /** The weekly development summary to each player of a team who wants it. */
  'summary.weekly': { teamId: number };
  /** The weekly schedule's tick: one 'summary.weekly' job for every team with players. */
  'summary.weekly-all': Record<string, never>;
}
export type JobName = keyof JobPayloads;

export interface JobPolicy {
  retryLimit: number;
  retryDelay: number;
  retryBackoff: boolean;
  expireInSeconds: number;
  deadLetter?: JobName;
}

export const JOB_POLICIES: { readonly [N in JobName]: JobPolicy } = {
  // SMTP relays reject briefly when busy: retry with backoff for about ten minutes.
  'mail.send': { retryLimit: 5, retryDelay: 20, retryBackoff: true, expireInSeconds: 60 },
  // Media jobs: a few retries for passing faults (storage briefly down, a worker killed). The expiry
  // is the lease: a job whose worker died is handed out again after it; see jobPolicies().
  'clip.process': { retryLimit: 3, retryDelay: 5, retryBackoff: true, expireInSeconds: 1200, deadLetter: 'clip.dead' },
  'tape.detect': { retryLimit: 2, retryDelay: 5, retryBackoff: true, expireInSeconds: 1200, deadLetter: 'clip.dead' },
  'tape.split': { retryLimit: 2, retryDelay: 5, retryBackoff: true, expireInSeconds: 3600, deadLetter: 'clip.dead' },
  'clip.dead': { retryLimit: 5, retryDelay: 5, retryBackoff: true, expireInSeconds: 60 },
  'digest.coaching': { retryLimit: 5, retryDelay: 30, retryBackoff: true, expireInSeconds: 120 },
  'summary.weekly': { retryLimit: 3, retryDelay: 60, retryBackoff: true, expireInSeconds: 600 },
  'summary.weekly-all': { retryLimit: 3, retryDelay: 60, retryBackoff: true, expireInSeconds: 300 },
};

/**
 * The policies with media job leases sized from the configured ffmpeg time limit, which applies to
 * each ffmpeg run: a clip job runs up to seven (probe, poster, strip, decode check, rendition, scene
 * detection, and a second decode to place damage), so its lease is seven limits plus a margin (at
 * most 30 s). A job whose worker died is handed out again once its lease has run out.
 */
export const FFMPEG_RUNS_PER_CLIP_JOB = 7;

export function jobPolicies(mediaTimeoutMs: number): { readonly [N in JobName]: JobPolicy } {
  const limit = Math.ceil(mediaTimeoutMs / 1000);
  const lease = FFMPEG_RUNS_PER_CLIP_JOB * limit + Math.min(30, limit);
  return {
    ...JOB_POLICIES,
    'clip.process': { ...JOB_POLICIES['clip.process'], expireInSeconds: lease },
    'tape.detect': { ...JOB_POLICIES['tape.detect'], expireInSeconds: lease },
  };
}

export const JOB_NAMES = Object.keys(JOB_POLICIES) as JobName[];
