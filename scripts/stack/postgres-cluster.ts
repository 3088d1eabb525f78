import { spawn } from 'node:child_process';
import { appendFileSync, chmodSync, chownSync, existsSync, mkdirSync, mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { Client } from 'pg';

export interface PostgresClusterOptions {
  /** PGDATA. Created with initdb when it holds no cluster yet. */
  readonly dataDir: string;
  readonly socketDir: string;
  readonly logFile: string;
  readonly port: number;
  /** Test clusters trade durability for speed (fsync off); they are deleted after the run anyway. */
  readonly throwaway: boolean;
  readonly binDir?: string;
}

export class PortInUseError extends Error {}

const DEFAULT_BIN_DIR = '/usr/lib/postgresql/15/bin';
// PostgreSQL refuses to run as root, so as root every server-side command runs as the postgres
// OS user (created by Debian's postgresql package); as anyone else it runs as that user.
const DB_OS_USER = 'postgres';

/**
 * A private PostgreSQL cluster owned by the OS user postgres, listening on 127.0.0.1 only.
 * Authentication is `trust` for that loopback listener and the private socket directory: the
 * cluster is a developer's local store, not reachable from other machines, and it keeps
 * DATABASE_URL free of a generated password. Production uses its own database and credentials.
 */
export class PostgresCluster {
  private readonly binDir: string;
  private readonly asRoot = process.getuid?.() === 0;

  constructor(readonly options: PostgresClusterOptions) {
    this.binDir = options.binDir ?? process.env.TW_PG_BIN_DIR ?? DEFAULT_BIN_DIR;
  }

  get port(): number {
    return this.options.port;
  }

  url(database: string): string {
    return `postgres://postgres@127.0.0.1:${this.options.port}/${encodeURIComponent(database)}`;
  }

  /** Runs initdb when the data directory holds no cluster. Returns true when it created one. */
  async initIfMissing(): Promise<boolean> {
    const { dataDir, throwaway } = this.options;
    if (!existsSync(join(this.binDir, 'initdb'))) {
      throw new Error(`PostgreSQL 15 is not installed (${this.binDir}/initdb is missing): apt-get install postgresql, or set DATABASE_URL`);
    }
    this.prepareDirectories();
    if (existsSync(join(dataDir, 'PG_VERSION'))) return false;
    const args = ['-D', dataDir, '-U', 'postgres', '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8'];
    if (throwaway) args.push('--no-sync');
    await this.runAsDbUser(join(this.binDir, 'initdb'), args, 'initdb');
    // Our settings live in their own file, rewritten before every start (the port can change).
    appendFileSync(join(dataDir, 'postgresql.conf'), "\n# Written by scripts/stack.ts before every start\ninclude_if_exists = 'trenchwork.conf'\n");
    return true;
  }

  async start(): Promise<void> {
    this.prepareDirectories();
    if (this.isRunning()) {
      // Left over from a stack that was killed without cleaning up: restart it with our settings.
      await this.stop('fast');
    }
    this.writeSettings();
    const { dataDir, logFile } = this.options;
    try {
      await this.runAsDbUser(join(this.binDir, 'pg_ctl'), ['-D', dataDir, '-l', logFile, '-w', '-t', '60', 'start'], 'pg_ctl start');
    } catch (error) {
      const tail = this.logTail();
      if (/Address already in use|could not create any TCP\/IP sockets/.test(tail)) {
        throw new PortInUseError(`port ${this.options.port} on 127.0.0.1 is already in use`);
      }
      throw new Error(`${(error as Error).message}\n--- ${logFile} (last lines) ---\n${tail}`);
    }
  }

  async stop(mode: 'fast' | 'immediate'): Promise<void> {
    if (!this.isRunning()) return;
    try {
      await this.runAsDbUser(join(this.binDir, 'pg_ctl'), ['-D', this.options.dataDir, '-m', mode, '-w', '-t', '60', 'stop'], 'pg_ctl stop');
    } catch (error) {
      const pid = this.postmasterPid();
      if (pid === undefined) return;
      // pg_ctl could not stop it: do not leave a server behind.
      try {
        process.kill(pid, 'SIGKILL');
      } catch {
        // Already gone.
      }
      throw error;
    }
  }

  /** True while the postmaster recorded in postmaster.pid is alive. */
  isRunning(): boolean {
    const pid = this.postmasterPid();
    if (pid === undefined) return false;
    try {
      process.kill(pid, 0);
      return true;
    } catch {
      return false;
    }
  }

  async ensureDatabase(name: string): Promise<boolean> {
    const client = new Client({ connectionString: this.url('postgres') });
    await client.connect();
    try {
      const found = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
      if (found.rowCount) return false;
      await client.query(`CREATE DATABASE "${name.replace(/"/g, '""')}"`);
      return true;
    } finally {
      await client.end();
    }
  }

  logTail(lines = 25): string {
    try {
      return readFileSync(this.options.logFile, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
    } catch {
      return '(no log)';
    }
  }

  private postmasterPid(): number | undefined {
    try {
      const pid = Number(readFileSync(join(this.options.dataDir, 'postmaster.pid'), 'utf8').split('\n')[0]);
      return Number.isInteger(pid) && pid > 0 ? pid : undefined;
    } catch {
      return undefined;
    }
  }

  private writeSettings(): void {
    const { port, socketDir, throwaway } = this.options;
    const quote = (value: string) => `'${value.replace(/'/g, "''")}'`;
    const lines = [
      `listen_addresses = '127.0.0.1'`,
      `port = ${port}`,
      `unix_socket_directories = ${quote(socketDir)}`,
      `timezone = 'UTC'`,
      `log_timezone = 'UTC'`,
    ];
    if (throwaway) {
      // Many jest workers each clone a template database and open a pool.
      lines.push('max_connections = 300', 'fsync = off', 'synchronous_commit = off', 'full_page_writes = off');
    }
    writeFileSync(join(this.options.dataDir, 'trenchwork.conf'), `${lines.join('\n')}\n`);
  }

  private prepareDirectories(): void {
    const { dataDir, socketDir, logFile } = this.options;
    mkdirSync(dirname(dataDir), { recursive: true });
    mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    mkdirSync(socketDir, { recursive: true, mode: 0o700 });
    mkdirSync(dirname(logFile), { recursive: true });
    if (!existsSync(logFile)) writeFileSync(logFile, '');
    if (!this.asRoot) return;
    chownToDbUser([dataDir, socketDir, logFile]);
    for (const path of [dataDir, socketDir, logFile]) openPassageToDbUser(dirname(path));
  }

  private runAsDbUser(command: string, args: string[], what: string): Promise<void> {
    const [file, argv] = this.asRoot ? ['runuser', ['-u', DB_OS_USER, '--', command, ...args]] : [command, args];
    return new Promise((resolve, reject) => {
      // cwd '/': runuser keeps the working directory, which the postgres user may not be able to
      // read. detached: Ctrl-C in the terminal must not interrupt initdb or pg_ctl halfway; the
      // stack lets them finish and then stops the server itself.
      const child = spawn(file, argv, { cwd: '/', detached: true, stdio: ['ignore', 'ignore', 'pipe'] });
      let stderr = '';
      child.stderr.setEncoding('utf8').on('data', (chunk: string) => (stderr += chunk));
      const timer = setTimeout(() => child.kill('SIGKILL'), 120_000);
      child.once('error', (error) => {
        clearTimeout(timer);
        reject(new Error(`${what} could not start: ${error.message}`));
      });
      child.once('close', (code, signal) => {
        clearTimeout(timer);
        if (code === 0) return resolve();
        const detail = stderr.trim() || (signal ? `killed by ${signal}` : `exit code ${code}`);
        if (/Permission denied/.test(detail)) {
          reject(new Error(`${what} failed: ${detail}\nThe postgres OS user must be able to reach ${this.options.dataDir}: every parent folder needs o+x (a checkout under /root does not qualify). Move the checkout, chmod o+x its parents, or set DATABASE_URL.`));
        } else {
          reject(new Error(`${what} failed: ${detail}`));
        }
      });
    });
  }
}

/**
 * The postgres OS user must pass through every folder above its data: a checkout under /root (mode
 * 700) or made with umask 077 blocks it, and initdb then fails with "Permission denied". Adding the
 * search bit for others (o+x) lets it pass without letting anyone list those folders; each change
 * is said once on stderr.
 */
function openPassageToDbUser(folder: string): void {
  for (let dir = folder; ; dir = dirname(dir)) {
    const { mode } = statSync(dir);
    if ((mode & 0o001) === 0) {
      chmodSync(dir, (mode & 0o7777) | 0o001);
      process.stderr.write(`[stack] gave the ${DB_OS_USER} user passage through ${dir} (chmod o+x, no listing) so PostgreSQL can reach its data\n`);
    }
    if (dir === dirname(dir)) return;
  }
}

let dbUserIds: { uid: number; gid: number } | undefined;

function chownToDbUser(paths: string[]): void {
  if (!dbUserIds) {
    const line = readFileSync('/etc/passwd', 'utf8').split('\n').find((l) => l.startsWith(`${DB_OS_USER}:`));
    if (!line) throw new Error(`there is no '${DB_OS_USER}' OS user: apt-get install postgresql creates it`);
    const [, , uid, gid] = line.split(':');
    dbUserIds = { uid: Number(uid), gid: Number(gid) };
  }
  for (const path of paths) chownSync(path, dbUserIds.uid, dbUserIds.gid);
}

// A Unix socket path may hold at most 107 bytes; a deep checkout gets its sockets in /tmp instead.
export function socketDirFor(preferred: string): string {
  if (preferred.length + '/.s.PGSQL.65535.lock'.length <= 100) return preferred;
  return mkdtempSync(join(tmpdir(), 'tw-pg-'));
}
