import { readdir } from 'node:fs/promises';
import path from 'node:path';
import pg from 'pg';
import { loadConfig } from '../server/core/config';
import { createObjectStorage } from '../server/core/storage';
import { formatBytes, formatSeconds, forEachLimited, parseCommandLine, Progress, runCommand } from './backup/cli';
import { countRows, listMigrations, listTables, quoteIdent, tableKey, totalRows } from './backup/database-inventory';
import { hashFile } from './backup/hashing';
import { readManifest, type Manifest } from './backup/manifest';
import { restoreObject } from './backup/object-copy';
import { resolveObjectFile } from './backup/object-paths';
import { describeDatabase, pgToolPath, runPgTool, toolConnection } from './backup/pg-tools';

/**
 * `npm run restore -- DIR [--force]`: a backup made by scripts/backup.ts into the configured
 * database and bucket. Everything in DIR is checked against manifest.json before anything is
 * changed; the target must hold no Trenchwork tables and no objects (--force drops the schemas and
 * overwrites objects). Afterwards row counts and every object's SHA-256 are checked again.
 * Stop the API and the workers first: they must not write while the restore runs.
 */
const USAGE = 'usage: npm run restore -- DIR [--force]   (DATABASE_URL and S3_* name the target, as for the server)';
const OBJECT_CONCURRENCY = 4;
const STEPS = 5;

async function verifyBackupFiles(dir: string, manifest: Manifest, progress: Progress): Promise<void> {
  const dump = await hashFile(path.join(dir, manifest.database.file)).catch((error: NodeJS.ErrnoException) => {
    throw new Error(error.code === 'ENOENT' ? `${manifest.database.file} is missing from ${dir}` : error.message);
  });
  if (dump.sha256 !== manifest.database.sha256 || dump.bytes !== manifest.database.bytes) {
    throw new Error(`${manifest.database.file} does not match the manifest (SHA-256 ${dump.sha256}, ${dump.bytes} bytes): the backup is damaged`);
  }
  const bad: string[] = [];
  const tick = progress.counter('checked', manifest.objects.count);
  let done = 0;
  await forEachLimited(manifest.objects.items, OBJECT_CONCURRENCY, async (item) => {
    try {
      const actual = await hashFile(await resolveObjectFile(dir, item.file));
      if (actual.sha256 !== item.sha256 || actual.bytes !== item.bytes) bad.push(`${item.key}: ${actual.bytes} bytes, SHA-256 ${actual.sha256} (manifest: ${item.bytes} bytes, ${item.sha256})`);
    } catch (error) {
      bad.push(`${item.key}: ${(error as NodeJS.ErrnoException).code === 'ENOENT' ? `${item.file} is missing` : (error as Error).message}`);
    }
    tick(++done);
  });
  if (bad.length) throw new Error(`${bad.length} object file(s) in the backup do not match the manifest; nothing was changed:\n  ${bad.slice(0, 20).join('\n  ')}`);
}

async function codeMigrations(): Promise<string[] | null> {
  try {
    const files = await readdir(path.join(__dirname, '..', 'db', 'migrations'));
    return files.filter((f) => /\.(ts|js)$/.test(f) && !f.endsWith('.d.ts')).map((f) => f.replace(/\.(ts|js)$/, '')).sort();
  } catch {
    return null;
  }
}

async function main(): Promise<number> {
  const args = parseCommandLine(process.argv.slice(2), USAGE);
  if (args === 'help') {
    process.stdout.write(`${USAGE}\n`);
    return 0;
  }
  const config = loadConfig();
  const dir = path.resolve(args.dir);
  const progress = new Progress();
  const manifest = await readManifest(dir);
  const target = describeDatabase(config.databaseUrl);
  progress.line(`Restore of ${dir}`);
  progress.line(`  made     ${manifest.createdAt} by Trenchwork ${manifest.app.version} from ${manifest.source.database}, bucket ${manifest.source.bucket}`);
  progress.line(`  into     database ${target}, bucket ${config.s3.bucket}${config.s3.endpoint ? ` at ${config.s3.endpoint}` : ' (AWS S3)'}`);

  progress.step(1, STEPS, `checking the backup: ${manifest.database.file} (${formatBytes(manifest.database.bytes)}) and ${manifest.objects.count} object files (${formatBytes(manifest.objects.bytes)})`);
  await verifyBackupFiles(dir, manifest, progress);

  const client = new pg.Client({ connectionString: config.databaseUrl, connectionTimeoutMillis: 10_000 });
  const storage = createObjectStorage(config);
  try {
    await client.connect().catch((error: Error) => {
      throw new Error(`cannot connect to the database ${target}: ${error.message}`);
    });
    progress.step(2, STEPS, 'checking the target');
    const present = (await listTables(client)).map(tableKey);
    const wanted = new Set([...Object.keys(manifest.database.tables), 'public.kysely_migration']);
    // public.* first: those names tell the operator more than pg-boss's partitions.
    const clashing = present.filter((t) => wanted.has(t)).sort((a, b) => Number(!a.startsWith('public.')) - Number(!b.startsWith('public.')) || a.localeCompare(b));
    if (clashing.length && !args.force) {
      throw new Error(`the database ${target} already holds Trenchwork tables (${clashing.slice(0, 4).join(', ')}${clashing.length > 4 ? ', …' : ''}). Restore into an empty database, or pass --force to drop its schemas and replace them.`);
    }
    await storage.ensureBucket().catch((error: Error) => {
      throw new Error(`the bucket ${config.s3.bucket} cannot be reached or created: ${error.message}`);
    });
    const existingKeys = await storage.list('');
    if (existingKeys.length && !args.force) {
      throw new Error(`the bucket ${config.s3.bucket} is not empty (${existingKeys.length} objects). Restore into an empty bucket, or pass --force to overwrite the backup's keys.`);
    }
    const backupKeys = new Set(manifest.objects.items.map((i) => i.key));
    const strangers = existingKeys.filter((k) => !backupKeys.has(k));

    const restoreStarted = Date.now();
    if (clashing.length) {
      const schemas = [...new Set([...Object.keys(manifest.database.tables).map((t) => t.slice(0, t.indexOf('.'))), 'public'])];
      progress.line(`      --force: dropping schema${schemas.length > 1 ? 's' : ''} ${schemas.join(', ')} (${present.length} tables)`);
      await client.query('begin');
      for (const schema of schemas) await client.query(`drop schema if exists ${quoteIdent(schema)} cascade`);
      await client.query('create schema public');
      await client.query('commit');
    }
    progress.step(3, STEPS, `database: pg_restore of ${manifest.database.file} (one transaction)`);
    const pgRestore = pgToolPath('pg_restore');
    const connection = toolConnection(config.databaseUrl);
    // --no-owner/--no-privileges: the restoring account (a hosted database's app user) owns what it restores.
    await runPgTool(
      pgRestore,
      ['--no-password', '--no-owner', '--no-privileges', '--exit-on-error', '--single-transaction', `--dbname=${connection.url}`, path.join(dir, manifest.database.file)],
      connection.env,
    );
    await client.query('analyze');
    progress.line(`      restored in ${formatSeconds(Date.now() - restoreStarted)}`);

    progress.step(4, STEPS, 'checking row counts and migrations against the manifest');
    const problems: string[] = [];
    const tables = await listTables(client);
    const counts = await countRows(client, tables);
    for (const [table, expected] of Object.entries(manifest.database.tables)) {
      if (!(table in counts)) problems.push(`table ${table} is missing after the restore`);
      else if (counts[table] !== expected) problems.push(`table ${table}: ${counts[table]} rows, the manifest says ${expected}`);
    }
    for (const table of Object.keys(counts)) if (!(table in manifest.database.tables)) problems.push(`table ${table} is in the database but not in the backup`);
    const migrations = (await listMigrations(client)) ?? [];
    if (migrations.join('\n') !== manifest.database.migrations.join('\n')) problems.push(`migrations after the restore (${migrations.length}) differ from the manifest's (${manifest.database.migrations.length})`);
    const restoredRows = totalRows(tables, counts);
    progress.line(`      ${Object.keys(counts).length} tables, ${restoredRows} rows${problems.length ? `, ${problems.length} problem(s)` : ': all match'}`);

    progress.step(5, STEPS, `objects: uploading ${manifest.objects.count} (${formatBytes(manifest.objects.bytes)}) into bucket ${config.s3.bucket}, each read back and hashed`);
    const tick = progress.counter('verified', manifest.objects.count);
    let done = 0;
    await forEachLimited(manifest.objects.items, OBJECT_CONCURRENCY, async (item) => {
      try {
        await restoreObject(storage, dir, item);
      } catch (error) {
        problems.push((error as Error).message);
      }
      tick(++done);
    });
    if (strangers.length) progress.line(`      note: ${strangers.length} object(s) already in the bucket are not in the backup; they were left as they were`);

    const known = await codeMigrations();
    if (known) {
      const unknown = manifest.database.migrations.filter((m) => !known.includes(m));
      const pending = known.filter((m) => !manifest.database.migrations.includes(m));
      if (unknown.length) progress.line(`  warning: the backup has ${unknown.length} migration(s) this code does not know (${unknown.join(', ')}): it was made by a newer Trenchwork; run that version.`);
      else if (pending.length) progress.line(`  note: ${pending.length} migration(s) of this code are not in the backup yet: run \`npm run migrate\` before starting the app.`);
    }
    if (problems.length) {
      process.stderr.write(`Restore finished with ${problems.length} mismatch(es):\n  ${problems.join('\n  ')}\n`);
      return 1;
    }
    progress.line(`Restore complete in ${formatSeconds(progress.elapsedMs())}: ${restoredRows} rows in ${Object.keys(counts).length} tables and ${manifest.objects.count} objects (${formatBytes(manifest.objects.bytes)}), all matching the manifest.`);
    return 0;
  } finally {
    storage.destroy();
    await client.end().catch(() => undefined);
  }
}

runCommand('restore', main);
