import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync, appendFileSync } from 'node:fs';
import { join } from 'node:path';
import { commandLineOf } from '../../scripts/stack/dev-lock';
import { entries, tsxChild } from '../../scripts/stack/entries';
import { describeExit, ManagedChild } from '../../scripts/stack/managed-child';
import { freePorts } from '../../scripts/stack/ports';
import { PortInUseError, PostgresCluster, socketDirFor } from '../../scripts/stack/postgres-cluster';
import { DEFAULT_BUCKET, s3Settings, serviceEnv, staticDir, throwawaySessionSecret, type S3Settings } from '../../scripts/stack/service-env';
import { waitForHttpOk } from '../../scripts/stack/wait-for-http';
import { progress, REPO_ROOT } from './bench-cli';
import { cleanUpOnInterrupt } from './interrupt';

const DATABASE = 'trenchwork_bench';
/** Set in the server's environment: a leftover server of a killed run is recognised by it, never by its command line alone. */
const RUN_MARKER = 'TW_BENCH_RUN';

export interface BenchStack {
  readonly runDir: string;
  readonly appUrl: string;
  readonly databaseUrl: string;
  readonly s3: S3Settings;
  /** The environment the server got (what loadConfig reads). */
  readonly env: NodeJS.ProcessEnv;
  readonly serverPid: number;
  readonly s3Pid: number;
  readonly serverLog: string;
}

/**
 * The real services on 127.0.0.1 for one benchmark run, reusing the stack's own parts
 * (scripts/stack): a fresh PostgreSQL cluster on a free port, the S3 fake as its own process,
 * migrations, and the API server as its own process (`node --import tsx server/main.ts`), all in
 * .data/bench-runs/<random>/. Everything is stopped and the folder deleted afterwards, also on
 * Ctrl-C; a run killed outright is cleaned up by the next one.
 */
export async function withBenchStack<T>(fn: (stack: BenchStack) => Promise<T>, options: { serverEnv?: Record<string, string> } = {}): Promise<T> {
  const runsDir = join(REPO_ROOT, '.data', 'bench-runs');
  mkdirSync(runsDir, { recursive: true });
  await removeAbandonedRuns(runsDir);
  const runId = randomBytes(6).toString('hex');
  const runDir = join(runsDir, runId);
  mkdirSync(runDir);
  writeFileSync(join(runDir, 'owner'), `${process.pid}\n`);

  const children: ManagedChild[] = [];
  let cluster: PostgresCluster | undefined;
  const socketDir = socketDirFor(join(runDir, 'pg-run'));
  let tornDown: Promise<void> | undefined;
  const teardown = () =>
    (tornDown ??= (async () => {
      for (const child of [...children].reverse()) await child.stop(10_000);
      await cluster?.stop('immediate').catch((error: Error) => progress(`could not stop PostgreSQL: ${error.message}`));
      rmSync(runDir, { recursive: true, force: true });
      if (!socketDir.startsWith(runDir)) rmSync(socketDir, { recursive: true, force: true });
    })());
  const release = cleanUpOnInterrupt("the benchmark's services", teardown);

  try {
    progress(`services in ${runDir}`);
    const s3Child = new ManagedChild({
      ...tsxChild('s3', entries.s3Fake(), REPO_ROOT, { ...process.env, TW_S3_DIR: join(runDir, 's3'), TW_S3_PORT: '0', S3_BUCKET: DEFAULT_BUCKET }, { file: join(runDir, 's3-fake.log') }),
      ipc: true,
    });
    children.push(s3Child);
    // Recorded as soon as it runs, so the teardown stops it even when the S3 fake fails meanwhile.
    const clusterReady = startCluster(runDir, socketDir).then((started) => (cluster = started));
    const [s3Ready] = await Promise.all([s3Child.waitForReady<{ port: number }>(30_000), clusterReady]);
    if (!cluster) throw new Error('PostgreSQL did not start');
    const [appPort] = await freePorts(1);
    const appUrl = `http://127.0.0.1:${appPort}`;
    const s3 = s3Settings({}, s3Ready.port);
    const env = serviceEnv(
      process.env,
      {
        nodeEnv: 'test',
        host: '127.0.0.1',
        port: appPort!,
        publicUrl: appUrl,
        databaseUrl: cluster.url(DATABASE),
        s3,
        // Nothing is mailed during a benchmark; the address only has to parse.
        smtpUrl: 'smtp://127.0.0.1:9',
        mailboxUrl: undefined,
        sessionSecret: throwawaySessionSecret(),
        staticDir: staticDir(REPO_ROOT),
      },
      { NODE_ENV: 'production', LOG_LEVEL: process.env.LOG_LEVEL || 'info', [RUN_MARKER]: runId, ...options.serverEnv },
    );

    const migrate = new ManagedChild(tsxChild('migrate', 'db/migrate.ts', REPO_ROOT, env, { file: join(runDir, 'migrate.log') }));
    const migrated = await migrate.exited;
    if (migrated.code !== 0) throw new Error(`migrations failed (${describeExit(migrated)})\n${migrate.logTail()}`);

    const serverLog = join(runDir, 'server.log');
    const serverSpec = tsxChild('server', entries.server(), REPO_ROOT, env, { file: serverLog });
    // BENCH_CPU_PROFILE_DIR=/some/dir: the server writes a V8 CPU profile there when it stops (open it in Chrome DevTools).
    const profileDir = process.env.BENCH_CPU_PROFILE_DIR;
    const server = new ManagedChild(profileDir ? { ...serverSpec, args: ['--cpu-prof', `--cpu-prof-dir=${profileDir}`, ...serverSpec.args] } : serverSpec);
    children.push(server);
    appendFileSync(join(runDir, 'owner'), `server ${server.pid}\n`);
    await Promise.race([
      waitForHttpOk(`${appUrl}/api/health`, 60_000),
      server.exited.then((exit) => {
        throw new Error(`the server stopped before it was ready (${describeExit(exit)})\n${server.logTail()}`);
      }),
    ]);
    progress(`server ${appUrl} (pid ${server.pid}), PostgreSQL :${cluster.port}, S3 fake :${s3Ready.port}`);
    return await fn({ runDir, appUrl, databaseUrl: env.DATABASE_URL!, s3, env, serverPid: server.pid!, s3Pid: s3Child.pid!, serverLog });
  } finally {
    release();
    await teardown();
  }
}

async function startCluster(runDir: string, socketDir: string): Promise<PostgresCluster> {
  const base = { dataDir: join(runDir, 'pg'), socketDir, logFile: join(runDir, 'postgres.log'), throwaway: true };
  await new PostgresCluster({ ...base, port: 0 }).initIfMissing();
  // The free port is only reserved until PostgreSQL binds it: retry if something took it meanwhile.
  for (let attempt = 1; ; attempt++) {
    const [port] = await freePorts(1);
    const cluster = new PostgresCluster({ ...base, port: port! });
    try {
      await cluster.start();
      await cluster.ensureDatabase(DATABASE);
      return cluster;
    } catch (error) {
      await cluster.stop('immediate').catch(() => undefined);
      if (!(error instanceof PortInUseError) || attempt >= 3) throw error;
    }
  }
}

/** Folders of runs whose process was killed: stop their server and PostgreSQL, delete them. */
async function removeAbandonedRuns(runsDir: string): Promise<void> {
  for (const name of readdirSync(runsDir)) {
    const dir = join(runsDir, name);
    let owner: string[] = [];
    try {
      owner = readFileSync(join(dir, 'owner'), 'utf8').trim().split('\n');
    } catch {
      // No owner file: a run killed while it was being created.
    }
    const ownerPid = Number(owner[0]);
    if (commandLineOf(ownerPid).includes('bench/')) continue;
    for (const line of owner.slice(1)) {
      const pid = Number(/^server (\d+)$/.exec(line)?.[1]);
      if (pid > 0 && environOf(pid).includes(`${RUN_MARKER}=${name}`)) {
        try {
          process.kill(-pid, 'SIGKILL');
        } catch {
          // Gone.
        }
      }
    }
    const dataDir = join(dir, 'pg');
    if (existsSync(join(dataDir, 'postmaster.pid'))) {
      const cluster = new PostgresCluster({ dataDir, socketDir: join(dir, 'pg-run'), logFile: join(dir, 'postgres.log'), port: 0, throwaway: true });
      await cluster.stop('immediate').catch((error: Error) => progress(`could not stop PostgreSQL of abandoned run ${name}: ${error.message}`));
    }
    rmSync(dir, { recursive: true, force: true });
    progress(`removed abandoned benchmark run ${name}`);
  }
}

function environOf(pid: number): string[] {
  try {
    return readFileSync(`/proc/${pid}/environ`, 'utf8').split('\0');
  } catch {
    return [];
  }
}
