import { z } from 'zod';

/**
 * The one typed configuration of the server and worker, read from the environment once at start.
 * Defaults suit `npm start` on one machine; production sets at least DATABASE_URL, SESSION_SECRET,
 * PUBLIC_URL, S3_* and SMTP_URL (see README "Configuration").
 */
const booleanFromEnv = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  PUBLIC_URL: z.url().optional(),
  DATABASE_URL: z.string().min(1).default('postgres://postgres@127.0.0.1:54320/trenchwork'),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(200).default(10),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters.').optional(),
  SESSION_IDLE_MINUTES: z.coerce.number().int().min(5).max(24 * 60).default(180),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().int().min(1).max(72).default(14),
  TRUST_PROXY: booleanFromEnv.default(false),
  STATIC_DIR: z.string().default('dist/trenchwork/browser'),
  // An empty value means "not set" (compose files often pass VAR= through).
  S3_ENDPOINT: z.preprocess((v) => (v === '' ? undefined : v), z.string().optional()),
  S3_REGION: z.string().default('us-east-1'),
  S3_BUCKET: z.string().default('trenchwork-media'),
  S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
  S3_FORCE_PATH_STYLE: booleanFromEnv.default(true),
  SMTP_URL: z.string().default('smtp://127.0.0.1:54325'),
  MAIL_FROM: z.string().default('Trenchwork <no-reply@trenchwork.test>'),
  DEV_MAILBOX_URL: z.string().optional(),
  FFMPEG_PATH: z.string().default('/usr/bin/ffmpeg'),
  FFPROBE_PATH: z.string().default('/usr/bin/ffprobe'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  LOGIN_MAX_FAILURES_PER_ACCOUNT: z.coerce.number().int().min(1).default(10),
  LOGIN_MAX_FAILURES_PER_IP: z.coerce.number().int().min(1).default(50),
  LOGIN_THROTTLE_WINDOW_MINUTES: z.coerce.number().int().min(1).default(15),
  INVITATION_TTL_HOURS: z.coerce.number().int().min(1).default(72),
  PASSWORD_RESET_TTL_MINUTES: z.coerce.number().int().min(5).default(30),
  WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(32).default(2),
  MAX_UPLOAD_BYTES: z.coerce.number().int().min(1024).default(4 * 1024 ** 3),
  MAX_UPLOAD_FILES: z.coerce.number().int().min(1).max(1000).default(200),
  MEDIA_TIMEOUT_SECONDS: z.coerce.number().int().min(1).max(7200).default(300),
  RENDITION_MAX_HEIGHT: z.coerce.number().int().min(144).max(2160).default(720),
  STRIP_FRAMES: z.coerce.number().int().min(2).max(200).default(40),
  JOB_MAINTENANCE_SECONDS: z.coerce.number().int().min(1).max(3600).default(60),
  DIGEST_DELAY_SECONDS: z.coerce.number().int().min(0).max(86400).default(120),
  // Five-field cron (minute hour day-of-month month day-of-week); 'off' sends none on a schedule.
  WEEKLY_SUMMARY_CRON: z
    .string()
    .trim()
    .regex(/^(off|(\S+\s+){4}\S+)$/, "five cron fields, e.g. '0 12 * * 1', or 'off'")
    .default('0 12 * * 1'),
  WEEKLY_SUMMARY_TZ: z
    .string()
    .trim()
    .refine((tz) => {
      try {
        new Intl.DateTimeFormat('en', { timeZone: tz });
        return true;
      } catch {
        return false;
      }
    }, 'an IANA time zone name')
    .default('UTC'),
});

export interface Config {
  readonly env: 'development' | 'test' | 'production';
  readonly host: string;
  readonly port: number;
  readonly publicUrl: string;
  readonly secureCookies: boolean;
  readonly trustProxy: boolean;
  readonly databaseUrl: string;
  readonly databasePoolMax: number;
  readonly sessionSecret: string;
  readonly sessionIdleMs: number;
  readonly sessionAbsoluteMs: number;
  readonly staticDir: string;
  readonly s3: {
    readonly endpoint: string | undefined;
    readonly region: string;
    readonly bucket: string;
    readonly accessKeyId: string;
    readonly secretAccessKey: string;
    readonly forcePathStyle: boolean;
  };
  readonly smtpUrl: string;
  readonly mailFrom: string;
  readonly devMailboxUrl: string | undefined;
  readonly ffmpegPath: string;
  readonly ffprobePath: string;
  readonly logLevel: string;
  readonly loginThrottle: { readonly perAccount: number; readonly perIp: number; readonly windowSeconds: number };
  readonly invitationTtlMs: number;
  readonly passwordResetTtlMs: number;
  readonly workerConcurrency: number;
  readonly media: {
    readonly maxUploadBytes: number;
    readonly maxUploadFiles: number;
    readonly timeoutMs: number;
    readonly renditionMaxHeight: number;
    readonly stripFrames: number;
  };
  /** How often the queue looks for expired (crashed) jobs to hand out again. */
  readonly jobMaintenanceSeconds: number;
  /** New coaching points wait this long before their digest goes, so a session's points arrive in one mail. */
  readonly digestDelaySeconds: number;
  /** When the weekly development summaries go out (cron in the time zone), or null when off. */
  readonly weeklySummary: { readonly cron: string; readonly timeZone: string } | null;
}

// Used only outside production when no secret is configured: sessions then do not survive
// a restart of a process that did not share it, which is fine for tests and never allowed in production.
const DEVELOPMENT_ONLY_SECRET = 'development-only-secret-not-for-production-use-0123456789';

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production') {
    // Production never falls back to the local fakes' addresses and keys.
    const required: [string, string | undefined][] = [
      ['SESSION_SECRET', e.SESSION_SECRET],
      ['DATABASE_URL', env.DATABASE_URL],
      ['PUBLIC_URL', env.PUBLIC_URL],
      ['SMTP_URL', env.SMTP_URL],
      ['S3_ACCESS_KEY_ID', env.S3_ACCESS_KEY_ID],
      ['S3_SECRET_ACCESS_KEY', env.S3_SECRET_ACCESS_KEY],
    ];
    const missing = required.filter(([, v]) => !v).map(([name]) => `  ${name}: required in production.`);
    if (missing.length > 0) throw new Error(`Invalid configuration:\n${missing.join('\n')}`);
  }
  const publicUrl = (e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`).replace(/\/$/, '');
  return Object.freeze({
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    publicUrl,
    secureCookies: publicUrl.startsWith('https://'),
    trustProxy: e.TRUST_PROXY,
    databaseUrl: e.DATABASE_URL,
    databasePoolMax: e.DATABASE_POOL_MAX,
    sessionSecret: e.SESSION_SECRET ?? DEVELOPMENT_ONLY_SECRET,
    sessionIdleMs: e.SESSION_IDLE_MINUTES * 60_000,
    sessionAbsoluteMs: e.SESSION_ABSOLUTE_HOURS * 3_600_000,
    staticDir: e.STATIC_DIR,
    s3: Object.freeze({
      endpoint: e.S3_ENDPOINT,
      region: e.S3_REGION,
      bucket: e.S3_BUCKET,
      accessKeyId: e.S3_ACCESS_KEY_ID,
      secretAccessKey: e.S3_SECRET_ACCESS_KEY,
      forcePathStyle: e.S3_FORCE_PATH_STYLE,
    }),
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    devMailboxUrl: e.NODE_ENV === 'production' ? undefined : e.DEV_MAILBOX_URL,
    ffmpegPath: e.FFMPEG_PATH,
    ffprobePath: e.FFPROBE_PATH,
    logLevel: e.LOG_LEVEL,
    loginThrottle: Object.freeze({
      perAccount: e.LOGIN_MAX_FAILURES_PER_ACCOUNT,
      perIp: e.LOGIN_MAX_FAILURES_PER_IP,
      windowSeconds: e.LOGIN_THROTTLE_WINDOW_MINUTES * 60,
    }),
    invitationTtlMs: e.INVITATION_TTL_HOURS * 3_600_000,
    passwordResetTtlMs: e.PASSWORD_RESET_TTL_MINUTES * 60_000,
    workerConcurrency: e.WORKER_CONCURRENCY,
    media: Object.freeze({
      maxUploadBytes: e.MAX_UPLOAD_BYTES,
      maxUploadFiles: e.MAX_UPLOAD_FILES,
      timeoutMs: e.MEDIA_TIMEOUT_SECONDS * 1000,
      renditionMaxHeight: e.RENDITION_MAX_HEIGHT,
      stripFrames: e.STRIP_FRAMES,
    }),
    jobMaintenanceSeconds: e.JOB_MAINTENANCE_SECONDS,
    digestDelaySeconds: e.DIGEST_DELAY_SECONDS,
    weeklySummary: e.WEEKLY_SUMMARY_CRON === 'off' ? null : Object.freeze({ cron: e.WEEKLY_SUMMARY_CRON, timeZone: e.WEEKLY_SUMMARY_TZ }),
  });
}
