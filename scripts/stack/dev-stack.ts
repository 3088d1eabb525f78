import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { DevLock } from './dev-lock';
import { entries, tsxChild } from './entries';
import { fail, paint, say, seconds } from './log';
import { assertPortsFree } from './ports';
import { PostgresCluster, socketDirFor } from './postgres-cluster';
import { parsePort, persistentSessionSecret, s3Settings, serviceEnv, staticDir } from './service-env';
import { settleAll, StackRuntime, StopRequested } from './stack-runtime';
import { waitForHttpOk } from './wait-for-http';

const DEMO_ACCOUNTS = ['admin', 'coordinator', 'coach', 'analyst', 'player'].map((role) => `${role}@trenchwork.test`);
const DATABASE = 'trenchwork';

/**
 * `npm start`: PostgreSQL, S3 fake and SMTP fake (each skipped when DATABASE_URL, S3_ENDPOINT or
 * SMTP_URL points elsewhere), migrations, seed, worker and server, all on 127.0.0.1 with data
 * kept in .data/dev. Returns the exit code.
 */
export async function runDevStack(root: string): Promise<number> {
  const started = Date.now();
  const env = process.env;
  const setupMs = Number(env.TW_SETUP_MS ?? 0);
  const devDir = join(root, '.data', 'dev');
  mkdirSync(devDir, { recursive: true });

  const host = env.HOST || '127.0.0.1';
  const port = parsePort(env.PORT, 3000, 'PORT');
  const ports = {
    pg: parsePort(env.TW_PG_PORT, 54320, 'TW_PG_PORT'),
    s3: parsePort(env.TW_S3_PORT, 54321, 'TW_S3_PORT'),
    smtp: parsePort(env.TW_SMTP_PORT, 54325, 'TW_SMTP_PORT'),
    mailbox: parsePort(env.TW_MAILBOX_PORT, 54326, 'TW_MAILBOX_PORT'),
  };
  const useOwn = { db: !env.DATABASE_URL, s3: !env.S3_ENDPOINT, smtp: !env.SMTP_URL };
  const localHost = host === '0.0.0.0' ? '127.0.0.1' : host;
  const appUrl = env.PUBLIC_URL || `http://${localHost}:${port}`;
  const mailboxUrl = useOwn.smtp ? `http://127.0.0.1:${ports.mailbox}` : env.DEV_MAILBOX_URL;

  const lock = new DevLock(join(devDir, 'stack.pid'));
  const claim = lock.claim({ url: appUrl, mailboxUrl });
  if (!claim.claimed) {
    say(`Trenchwork is already running (pid ${claim.pid}): ${claim.url}`);
    if (claim.mailboxUrl) say(`Dev mailbox: ${claim.mailboxUrl}/messages`);
    return 0;
  }

  const runtime = new StackRuntime();
  try {
    const cluster = useOwn.db
      ? new PostgresCluster({ dataDir: join(devDir, 'pg'), socketDir: socketDirFor(join(devDir, 'pg-run')), logFile: join(devDir, 'postgres.log'), port: ports.pg, throwaway: false })
      : undefined;
    if (cluster?.isRunning()) {
      // We hold the dev lock, so this server is a leftover of a stack that was killed.
      say('stopping the PostgreSQL a killed stack left running');
      await runtime.track(cluster.stop('fast'));
    }
    await assertPortsFree([
      { port, what: 'the app', variable: 'PORT' },
      ...(useOwn.db ? [{ port: ports.pg, what: 'PostgreSQL', variable: 'TW_PG_PORT' }] : []),
      ...(useOwn.s3 ? [{ port: ports.s3, what: 'the S3 fake', variable: 'TW_S3_PORT' }] : []),
      ...(useOwn.smtp
        ? [
            { port: ports.smtp, what: 'the SMTP fake', variable: 'TW_SMTP_PORT' },
            { port: ports.mailbox, what: 'the dev mailbox', variable: 'TW_MAILBOX_PORT' },
          ]
        : []),
    ]);
    const sessionSecret = env.SESSION_SECRET || persistentSessionSecret(join(devDir, 'session-secret'));
    const s3 = s3Settings(env, useOwn.s3 ? ports.s3 : undefined);

    // The three services are independent: start them side by side.
    const databaseReady = (async () => {
      if (!cluster) return;
      if (await runtime.step(runtime.track(cluster.initIfMissing()))) say(`created a PostgreSQL cluster in ${cluster.options.dataDir}`);
      await runtime.startCluster(cluster);
      if (await runtime.step(cluster.ensureDatabase(DATABASE))) say(`created database ${DATABASE}`);
    })();
    const s3Ready = useOwn.s3
      ? runtime.startService(
          tsxChild('s3', entries.s3Fake(), root, { ...env, TW_S3_DIR: join(devDir, 's3'), TW_S3_PORT: String(ports.s3), S3_BUCKET: s3.bucket }),
        )
      : Promise.resolve();
    const smtpReady = useOwn.smtp
      ? runtime.startService(
          tsxChild('mail', entries.smtpFake(), root, {
            ...env,
            TW_SMTP_PORT: String(ports.smtp),
            TW_MAILBOX_PORT: String(ports.mailbox),
            TW_MAIL_FILE: join(devDir, 'mail.json'),
          }),
        )
      : Promise.resolve();
    await settleAll([databaseReady, s3Ready, smtpReady]);
    const servicesMs = Date.now() - started;

    const childEnv = serviceEnv(env, {
      nodeEnv: 'development',
      host,
      port,
      publicUrl: appUrl,
      databaseUrl: cluster ? cluster.url(DATABASE) : (env.DATABASE_URL as string),
      s3,
      smtpUrl: useOwn.smtp ? `smtp://127.0.0.1:${ports.smtp}` : (env.SMTP_URL as string),
      mailboxUrl,
      sessionSecret,
      staticDir: staticDir(root),
    });

    await runtime.runTask(tsxChild('migrate', entries.migrate(), root, childEnv));
    await runtime.runTask(tsxChild('seed', entries.seed(), root, childEnv));
    const tasksMs = Date.now() - started - servicesMs;

    const worker = runtime.spawn(tsxChild('worker', entries.worker(), root, childEnv), 'app', true);
    lock.recordChild('worker', worker.pid, entries.worker());
    const server = runtime.spawn(tsxChild('server', entries.server(), root, childEnv), 'app', true);
    lock.recordChild('server', server.pid, entries.server());

    const healthTimeoutMs = Number(env.TW_HEALTH_TIMEOUT_MS ?? 90_000);
    await runtime.step(waitForHttpOk(`http://${localHost}:${port}/api/health`, healthTimeoutMs));
    printBanner({
      appUrl,
      mailboxUrl,
      databaseUrl: childEnv.DATABASE_URL as string,
      s3: `${s3.endpoint} (bucket ${s3.bucket})`,
      smtpUrl: childEnv.SMTP_URL as string,
      demoPassword: env.DEMO_PASSWORD ? 'the DEMO_PASSWORD you set' : 'trenchwork-demo',
      timing: `Ready in ${seconds(setupMs + Date.now() - started)} (setup ${seconds(setupMs)}, services ${seconds(servicesMs)}, migrate + seed ${seconds(tasksMs)}, app ${seconds(Date.now() - started - servicesMs - tasksMs)})`,
    });

    const reason = await runtime.untilStop();
    if (reason.kind === 'failure') {
      fail(reason.message);
      return 1;
    }
    return 0;
  } catch (error) {
    if (error instanceof StopRequested && error.reason.kind === 'signal') return 0;
    fail(error instanceof Error ? error.message : String(error));
    return 1;
  } finally {
    say('stopping server, worker, fakes and PostgreSQL...');
    await runtime.shutdown();
    lock.release();
    say('stopped; data kept in .data/dev');
  }
}

function printBanner(info: {
  appUrl: string;
  mailboxUrl: string | undefined;
  databaseUrl: string;
  s3: string;
  smtpUrl: string;
  demoPassword: string;
  timing: string;
}): void {
  const bold = (text: string) => paint(1, text);
  const lines = [
    '',
    `  ${bold('Trenchwork is running:')} ${paint(32, info.appUrl)}`,
    '',
    `  Dev mailbox   ${info.mailboxUrl ? `${info.appUrl}/dev/mailbox (raw: ${info.mailboxUrl}/messages)` : '(none: SMTP_URL points elsewhere)'}`,
    `  SMTP          ${info.smtpUrl}`,
    `  PostgreSQL    ${info.databaseUrl.replace(/\/\/([^:@/]+):[^@/]+@/, '//$1:***@')}`,
    `  S3            ${info.s3}`,
    '',
    `  Demo sign-ins (password: ${info.demoPassword}):`,
    ...DEMO_ACCOUNTS.map((account) => `    ${account}`),
    '',
    `  ${info.timing}. Ctrl-C stops everything; data stays in .data/dev.`,
    '',
  ];
  process.stdout.write(`${lines.join('\n')}\n`);
}
