import type { S3ClientConfig } from '@aws-sdk/client-s3';

/**
 * The services `npm test` started for this run (scripts/stack/test-stack.ts), read from the
 * environment it passed to jest. Every jest worker shares them: give S3 keys and mail recipients a
 * per-test prefix, and clone the database (test-database.ts) instead of writing to the template.
 */
export interface TestServices {
  /** The migrated template database, trenchwork_test. Clone it; do not write to it. */
  readonly databaseUrl: string;
  /** The same server's `postgres` database, for CREATE DATABASE … TEMPLATE trenchwork_test. */
  readonly databaseAdminUrl: string;
  readonly s3: { readonly endpoint: string; readonly region: string; readonly bucket: string; readonly accessKeyId: string; readonly secretAccessKey: string };
  readonly smtpUrl: string;
  /** Base URL of the SMTP fake's listing: GET/DELETE `${mailboxUrl}/messages`. */
  readonly mailboxUrl: string;
  /** This run's throwaway folder (deleted after the run), for scratch files. */
  readonly runDir: string;
  readonly chromiumPath: string;
  readonly ffmpegPath: string;
  readonly ffprobePath: string;
}

function required(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run the tests with \`npm test\` (scripts/test.sh starts the services and sets it).`);
  return value;
}

export function testServices(): TestServices {
  return {
    databaseUrl: required('DATABASE_URL'),
    databaseAdminUrl: required('TEST_DATABASE_ADMIN_URL'),
    s3: {
      endpoint: required('S3_ENDPOINT'),
      region: required('S3_REGION'),
      bucket: required('S3_BUCKET'),
      accessKeyId: required('S3_ACCESS_KEY_ID'),
      secretAccessKey: required('S3_SECRET_ACCESS_KEY'),
    },
    smtpUrl: required('SMTP_URL'),
    mailboxUrl: required('DEV_MAILBOX_URL'),
    runDir: required('TW_TEST_RUN_DIR'),
    chromiumPath: process.env.CHROMIUM_PATH || '/usr/lib/chromium/chromium',
    ffmpegPath: process.env.FFMPEG_PATH || '/usr/bin/ffmpeg',
    ffprobePath: process.env.FFPROBE_PATH || '/usr/bin/ffprobe',
  };
}

/**
 * Client settings for the S3 fake. The checksum settings are not optional: with the SDK's default
 * checksums s3rver silently stores streamed uploads corrupted.
 */
export function testS3ClientConfig(services: TestServices = testServices()): S3ClientConfig {
  return {
    endpoint: services.s3.endpoint,
    region: services.s3.region,
    forcePathStyle: true,
    credentials: { accessKeyId: services.s3.accessKeyId, secretAccessKey: services.s3.secretAccessKey },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  };
}
