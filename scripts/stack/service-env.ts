import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

/** Where the services of one stack run; turned into the environment the server's config reads. */
export interface StackEndpoints {
  readonly nodeEnv: 'development' | 'test';
  readonly host: string;
  readonly port: number;
  readonly publicUrl: string;
  readonly databaseUrl: string;
  readonly s3: S3Settings;
  readonly smtpUrl: string;
  readonly mailboxUrl: string | undefined;
  readonly sessionSecret: string;
  readonly staticDir: string;
}

export interface S3Settings {
  readonly endpoint: string;
  readonly region: string;
  readonly bucket: string;
  readonly accessKeyId: string;
  readonly secretAccessKey: string;
}

export const DEFAULT_BUCKET = 'trenchwork-media';
// s3rver accepts any bucket operation signed with these.
const FAKE_S3_KEY = 'S3RVER';

/** S3 settings for the fake on `port`, or for the store the caller configured with S3_ENDPOINT. */
export function s3Settings(env: NodeJS.ProcessEnv, fakePort: number | undefined): S3Settings {
  const external = fakePort === undefined;
  return {
    endpoint: external ? (env.S3_ENDPOINT as string) : `http://127.0.0.1:${fakePort}`,
    region: (external && env.S3_REGION) || 'us-east-1',
    bucket: (external && env.S3_BUCKET) || DEFAULT_BUCKET,
    accessKeyId: (external && env.S3_ACCESS_KEY_ID) || FAKE_S3_KEY,
    secretAccessKey: (external && env.S3_SECRET_ACCESS_KEY) || FAKE_S3_KEY,
  };
}

/**
 * The environment for migrations, seed, worker, server and jest: everything inherited (LOG_LEVEL,
 * DEMO_PASSWORD, …) plus the stack's contract, which wins over inherited values.
 */
export function serviceEnv(inherited: NodeJS.ProcessEnv, e: StackEndpoints, extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = {
    ...inherited,
    NODE_ENV: e.nodeEnv,
    HOST: e.host,
    PORT: String(e.port),
    PUBLIC_URL: e.publicUrl,
    DATABASE_URL: e.databaseUrl,
    S3_ENDPOINT: e.s3.endpoint,
    S3_REGION: e.s3.region,
    S3_BUCKET: e.s3.bucket,
    S3_ACCESS_KEY_ID: e.s3.accessKeyId,
    S3_SECRET_ACCESS_KEY: e.s3.secretAccessKey,
    S3_FORCE_PATH_STYLE: inherited.S3_FORCE_PATH_STYLE || 'true',
    SMTP_URL: e.smtpUrl,
    MAIL_FROM: inherited.MAIL_FROM || 'Trenchwork <no-reply@trenchwork.test>',
    SESSION_SECRET: e.sessionSecret,
    STATIC_DIR: e.staticDir,
    FFMPEG_PATH: inherited.FFMPEG_PATH || '/usr/bin/ffmpeg',
    FFPROBE_PATH: inherited.FFPROBE_PATH || '/usr/bin/ffprobe',
    CHROMIUM_PATH: inherited.CHROMIUM_PATH || '/usr/lib/chromium/chromium',
    ...extra,
  };
  if (e.mailboxUrl) env.DEV_MAILBOX_URL = e.mailboxUrl;
  else delete env.DEV_MAILBOX_URL;
  return env;
}

/** The dev secret is made once and kept, so sessions survive a restart of the stack. */
export function persistentSessionSecret(file: string): string {
  if (existsSync(file)) {
    const saved = readFileSync(file, 'utf8').trim();
    if (saved.length >= 32) return saved;
  }
  mkdirSync(dirname(file), { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  chmodSync(file, 0o600);
  return secret;
}

export function throwawaySessionSecret(): string {
  return randomBytes(48).toString('base64url');
}

export function parsePort(raw: string | undefined, fallback: number, variable: string): number {
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error(`${variable} must be a port number (1-65535), got '${raw}'`);
  return port;
}

export function staticDir(root: string): string {
  return join(root, 'dist', 'trenchwork', 'browser');
}
