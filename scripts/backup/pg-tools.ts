import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';

/**
 * pg_dump and pg_restore, found in PG_BIN_DIR when set, else PostgreSQL 15's Debian folder, else
 * on PATH. They always run with an argument array (no shell) and connect by URL, so they never need
 * the postgres OS user. The password travels in PGPASSWORD, never on the command line, where any
 * local user could read it from the process list.
 */
const DEBIAN_BIN_DIR = '/usr/lib/postgresql/15/bin';

export function pgToolPath(tool: 'pg_dump' | 'pg_restore', env: NodeJS.ProcessEnv = process.env): string {
  if (env.PG_BIN_DIR) {
    const explicit = path.join(env.PG_BIN_DIR, tool);
    if (!existsSync(explicit)) throw new Error(`${explicit} does not exist (PG_BIN_DIR=${env.PG_BIN_DIR})`);
    return explicit;
  }
  const debian = path.join(DEBIAN_BIN_DIR, tool);
  return existsSync(debian) ? debian : tool;
}

export interface ToolConnection {
  /** The connection URL without its password. */
  url: string;
  env: NodeJS.ProcessEnv;
}

export function toolConnection(databaseUrl: string, baseEnv: NodeJS.ProcessEnv = process.env): ToolConnection {
  const env: NodeJS.ProcessEnv = { ...baseEnv };
  // Settings inherited from the shell must not redirect the tools to another server or database.
  for (const name of ['PGHOST', 'PGPORT', 'PGDATABASE', 'PGUSER', 'PGPASSWORD', 'PGSERVICE', 'PGOPTIONS']) delete env[name];
  let url: URL;
  try {
    url = new URL(databaseUrl);
  } catch {
    // A key=value connection string: passed on as it is.
    return { url: databaseUrl, env };
  }
  if (url.password) {
    env.PGPASSWORD = decodeURIComponent(url.password);
    url.password = '';
  }
  return { url: url.toString(), env };
}

/** host:port/database of a URL, for messages and the manifest: never the user's password. */
export function describeDatabase(databaseUrl: string): string {
  try {
    const url = new URL(databaseUrl);
    return `${url.username ? `${decodeURIComponent(url.username)}@` : ''}${url.host}${url.pathname}`;
  } catch {
    return '(connection string)';
  }
}

/** Runs a PostgreSQL client tool; resolves with stdout, rejects with the exit status and stderr's last lines. */
export function runPgTool(command: string, args: readonly string[], env: NodeJS.ProcessEnv): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, [...args], { env, stdio: ['ignore', 'pipe', 'pipe'], shell: false });
    const stdout: Buffer[] = [];
    const stderr: Buffer[] = [];
    child.stdout.on('data', (chunk: Buffer) => stdout.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => stderr.push(chunk));
    child.once('error', (error) => {
      reject(new Error(`could not run ${command}: ${error.message}${(error as NodeJS.ErrnoException).code === 'ENOENT' ? ' (install the PostgreSQL 15 client, or set PG_BIN_DIR)' : ''}`));
    });
    child.once('close', (code, signal) => {
      if (code === 0) return resolve(Buffer.concat(stdout).toString('utf8'));
      const tail = Buffer.concat(stderr).toString('utf8').trim().split('\n').slice(-12).join('\n');
      reject(new Error(`${path.basename(command)} ${signal ? `was killed by ${signal}` : `exited with ${code}`}${tail ? `:\n${tail}` : ''}`));
    });
  });
}
