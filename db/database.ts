import { Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import type { DB } from './types';

// int8 (bigserial ids, counts) → number: ids stay far below 2^53. DATE → the plain 'YYYY-MM-DD' string,
// so a game date never shifts with the server's time zone.
pg.types.setTypeParser(pg.types.builtins.INT8, (value) => Number(value));
pg.types.setTypeParser(pg.types.builtins.DATE, (value) => value);

export type Database = Kysely<DB>;

export interface DatabaseHandle {
  db: Database;
  pool: pg.Pool;
  close(): Promise<void>;
}

export function createDatabase(connectionString: string, options: { max?: number } = {}): DatabaseHandle {
  const pool = new pg.Pool({
    connectionString,
    max: options.max ?? 10,
    // Keep every session in UTC so timestamps round-trip unchanged (connect-pg-simple relies on it too).
    options: '-c TimeZone=UTC',
    connectionTimeoutMillis: 5000,
    idleTimeoutMillis: 30000,
  });
  // An idle client losing its connection (database restart) must not crash the process.
  pool.on('error', () => undefined);
  // Nor may a checked-out one: pg emits 'error' on a client whose connection the server ends between
  // two queries (a transaction in progress during `pg_ctl stop`), and the pool listens only while
  // the client is idle. Its next query fails instead, and the pool drops it on release.
  pool.on('connect', (client) => client.on('error', () => undefined));
  const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool }) });
  return {
    db,
    pool,
    async close() {
      await db.destroy();
    },
  };
}
