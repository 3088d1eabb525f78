import { promises as fs } from 'node:fs';
import path from 'node:path';
import { FileMigrationProvider, Migrator, type Kysely } from 'kysely';

/** Runs every pending migration in db/migrations; throws with the failing migration's name. */
export async function migrateToLatest(db: Kysely<any>): Promise<string[]> {
  const migrator = new Migrator({
    db,
    provider: new FileMigrationProvider({ fs, path, migrationFolder: path.join(__dirname, 'migrations') }),
  });
  const { error, results } = await migrator.migrateToLatest();
  const failed = results?.find((r) => r.status === 'Error');
  if (error) {
    throw new Error(`Migration ${failed?.migrationName ?? ''} failed: ${error instanceof Error ? error.message : String(error)}`);
  }
  return (results ?? []).filter((r) => r.status === 'Success').map((r) => r.migrationName);
}
