import { createDatabase } from './database';
import { migrateToLatest } from './migrator';

// `npm run migrate`: brings DATABASE_URL's schema up to date.
async function main(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set.');
  const handle = createDatabase(url, { max: 1 });
  try {
    const applied = await migrateToLatest(handle.db);
    console.log(applied.length ? `Applied migrations: ${applied.join(', ')}` : 'Database schema is up to date.');
  } finally {
    await handle.close();
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
