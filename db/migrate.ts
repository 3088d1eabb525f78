import { createDatabase } from './database';
import PgBoss from 'pg-boss';
import { migrateToLatest } from './migrator';

// `npm run migrate`: brings DATABASE_URL's schema up to date.
async function main(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set.');
  const handle = createDatabase(url, { max: 1 });
  try {
    const applied = await migrateToLatest(handle.db);
    console.log(applied.length ? `Applied migrations: ${applied.join(', ')}` : 'Database schema is up to date.');
    // The job queue keeps its own schema (pgboss); installing it here means no process races to create it.
    const boss = new PgBoss({ connectionString: url, schema: 'pgboss', supervise: false, schedule: false, max: 1 });
    boss.on('error', () => undefined);
    await boss.start();
    await boss.stop({ graceful: false, wait: true });
  } finally {
    await handle.close();
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
