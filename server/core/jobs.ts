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

export interface JobPayloads {
  'mail.send': MailMessage;
}
export type JobName = keyof JobPayloads;

export interface JobPolicy {
  retryLimit: number;
  retryDelay: number;
  retryBackoff: boolean;
  expireInSeconds: number;
}

export const JOB_POLICIES: { readonly [N in JobName]: JobPolicy } = {
  // SMTP relays reject briefly when busy: retry with backoff for about ten minutes.
  'mail.send': { retryLimit: 5, retryDelay: 20, retryBackoff: true, expireInSeconds: 60 },
};

export const JOB_NAMES = Object.keys(JOB_POLICIES) as JobName[];
