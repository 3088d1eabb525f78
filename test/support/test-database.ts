import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { createDatabase, type DatabaseHandle } from '../../db/database';

/**
 * Each test file gets its own database, cloned from the migrated template that `npm test` prepared
 * (DATABASE_URL), so files never see each other's rows and can run in parallel.
 */
export interface TestDatabase {
  url: string;
  handle: DatabaseHandle;
  drop(): Promise<void>;
}

function requireEnv(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run the tests with \`npm test\`, which starts the services.`);
  return value;
}

export async function createTestDatabase(): Promise<TestDatabase> {
  const templateUrl = new URL(requireEnv('DATABASE_URL'));
  const adminUrl = requireEnv('TEST_DATABASE_ADMIN_URL');
  const template = templateUrl.pathname.slice(1);
  const name = `${template}_${process.pid}_${randomBytes(4).toString('hex')}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  try {
    await admin.query(`CREATE DATABASE "${name}" TEMPLATE "${template}"`);
  } finally {
    await admin.end();
  }
  const url = new URL(templateUrl.toString());
  url.pathname = `/${name}`;
  const handle = createDatabase(url.toString(), { max: 10 });
  return {
    url: url.toString(),
    handle,
    async drop() {
      await handle.close();
      const client = new pg.Client({ connectionString: adminUrl });
      await client.connect();
      try {
        await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      } finally {
        await client.end();
      }
    },
  };
}
