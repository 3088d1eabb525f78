import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { commandLineOf } from './dev-lock';
import { entries, tsxChild } from './entries';
import { fail, say, seconds, warn } from './log';
import { describeExit } from './managed-child';
import { freePorts } from './ports';
import { PortInUseError, PostgresCluster, socketDirFor } from './postgres-cluster';
import { DEFAULT_BUCKET, s3Settings, serviceEnv, staticDir, throwawaySessionSecret } from './service-env';
import { settleAll, StackRuntime, StopRequested } from './stack-runtime';

const DATABASE = 'trenchwork_test';
const TEST_MARKER = 'scripts/stack.ts test';

/**
 * `npm test`: fresh services on free ports in .data/test-runs/<id>/ (so it never touches the dev
 * data and parallel runs do not collide), migrations, then one jest run with the services in its
 * environment; everything is torn down and the folder deleted. Returns jest's exit code.
 */
export async function runTestStack(root: string, jestArgs: readonly string[]): Promise<number> {
  const started = Date.now();
  const runsDir = join(root, '.data', 'test-runs');
  mkdirSync(runsDir, { recursive: true });
  await removeAbandonedRuns(runsDir);
  const runDir = join(runsDir, `${process.pid}-${randomBytes(4).toString('hex')}`);
  mkdirSync(runDir);

  const runtime = new StackRuntime();
  const timings: [string, number][] = [['setup', Number(process.env.TW_SETUP_MS ?? 0)]];
  const mark = (() => {
    let last = Date.now();
    return (label: string) => {
      const now = Date.now();
      timings.push([label, now - last]);
      last = now;
    };
  })();
  let exitCode = 1;
  try {
    const [appPort] = await freePorts(1);
    const socketDir = socketDirFor(join(runDir, 'pg-run'));
    const databaseReady = startThrowawayCluster(runtime, runDir, socketDir);
    // Fakes bind port 0 and report the port they got: no race for ports with a parallel run.
    const s3Ready = runtime.startService<{ port: number }>(
      tsxChild('s3', entries.s3Fake(), root, { ...process.env, TW_S3_DIR: join(runDir, 's3'), TW_S3_PORT: '0', S3_BUCKET: DEFAULT_BUCKET }, { file: join(runDir, 's3-fake.log') }),
    );
    const smtpReady = runtime.startService<{ smtpPort: number; httpPort: number }>(
      tsxChild('mail', entries.smtpFake(), root, { ...process.env, TW_SMTP_PORT: '0', TW_MAILBOX_PORT: '0', TW_MAIL_FILE: '' }, { file: join(runDir, 'smtp-fake.log') }),
    );
    await settleAll([databaseReady, s3Ready, smtpReady]);
    const [cluster, s3, smtp] = [await databaseReady, await s3Ready, await smtpReady];
    mark('services');

    const env = serviceEnv(
      process.env,
      {
        nodeEnv: 'test',
        host: '127.0.0.1',
        port: appPort,
        publicUrl: `http://127.0.0.1:${appPort}`,
        databaseUrl: cluster.url(DATABASE),
        s3: s3Settings({}, s3.port),
        smtpUrl: `smtp://127.0.0.1:${smtp.smtpPort}`,
        mailboxUrl: `http://127.0.0.1:${smtp.httpPort}`,
        sessionSecret: throwawaySessionSecret(),
        staticDir: staticDir(root),
      },
      // Tests clone trenchwork_test (CREATE DATABASE … TEMPLATE trenchwork_test) through this.
      { TEST_DATABASE_ADMIN_URL: cluster.url('postgres'), TW_TEST_RUN_DIR: runDir },
    );
    await runtime.runTask(tsxChild('migrate', entries.migrate(), root, env));
    mark('migrate');

    const jest = runtime.spawn(
      { name: 'jest', command: process.execPath, args: [require.resolve('jest/bin/jest', { paths: [root] }), ...jestArgs], cwd: root, env, output: 'inherit', detached: false },
      'app',
      false,
    );
    const exit = await runtime.step(jest.exited);
    mark('jest');
    exitCode = exit.code ?? 1;
    if (exit.code === null) warn(`jest ${describeExit(exit)}`);
  } catch (error) {
    if (error instanceof StopRequested && error.reason.kind === 'signal') {
      exitCode = 130;
    } else {
      fail(error instanceof Error ? error.message : String(error));
      exitCode = 1;
    }
  } finally {
    const teardownStarted = Date.now();
    await runtime.shutdown();
    rmSync(runDir, { recursive: true, force: true });
    timings.push(['teardown', Date.now() - teardownStarted]);
    const summary = timings.map(([label, ms]) => `${label} ${seconds(ms)}`).join(' · ');
    say(`test run: ${summary} · total ${seconds(Date.now() - started + timings[0][1])} (exit ${exitCode})`);
  }
  return exitCode;
}

async function startThrowawayCluster(runtime: StackRuntime, runDir: string, socketDir: string): Promise<PostgresCluster> {
  const base = { dataDir: join(runDir, 'pg'), socketDir, logFile: join(runDir, 'postgres.log'), throwaway: true };
  await runtime.step(runtime.track(new PostgresCluster({ ...base, port: 0 }).initIfMissing()));
  // The port is only reserved between freePorts() and PostgreSQL binding it; retry if another
  // program took it in that moment.
  for (let attempt = 1; ; attempt++) {
    const [port] = await freePorts(1);
    const cluster = new PostgresCluster({ ...base, port });
    try {
      await runtime.startCluster(cluster);
      await runtime.step(cluster.ensureDatabase(DATABASE));
      return cluster;
    } catch (error) {
      if (!(error instanceof PortInUseError) || attempt >= 3) throw error;
    }
  }
}

/** Runs whose orchestrator was killed leave a folder (and maybe a PostgreSQL): clean them up. */
async function removeAbandonedRuns(runsDir: string): Promise<void> {
  for (const name of readdirSync(runsDir)) {
    const pid = Number(name.split('-')[0]);
    if (commandLineOf(pid).includes(TEST_MARKER)) continue;
    const dir = join(runsDir, name);
    const dataDir = join(dir, 'pg');
    if (existsSync(join(dataDir, 'postmaster.pid'))) {
      const cluster = new PostgresCluster({ dataDir, socketDir: join(dir, 'pg-run'), logFile: join(dir, 'postgres.log'), port: 0, throwaway: true });
      await cluster.stop('immediate').catch((error: Error) => warn(`could not stop PostgreSQL of abandoned run ${name}: ${error.message}`));
    }
    rmSync(dir, { recursive: true, force: true });
    say(`removed abandoned test run ${name}`);
  }
}
