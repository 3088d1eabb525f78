import { readdir, stat } from 'node:fs/promises';
import path from 'node:path';
import pg from 'pg';
import { loadConfig } from '../server/core/config';
import { createObjectStorage } from '../server/core/storage';
import { prepareBackupDirectory } from './backup/backup-directory';
import { forEachLimited, formatBytes, formatSeconds, parseCommandLine, Progress, runCommand } from './backup/cli';
import { countRows, listMigrations, listTables, serverVersion, totalRows as sumRows } from './backup/database-inventory';
import { hashFile } from './backup/hashing';
import { DUMP_FILE, MANIFEST_FORMAT, MANIFEST_VERSION, writeManifest, type Manifest, type ObjectEntry } from './backup/manifest';
import { backupObject } from './backup/object-copy';
import { describeDatabase, pgToolPath, runPgTool, toolConnection } from './backup/pg-tools';

/**
 * `npm run backup -- DIR [--force]`: the configured database (pg_dump, custom format) and every
 * object of the configured bucket into DIR, with manifest.json last. The row counts are taken in the
 * very snapshot pg_dump reads, so they match the dump even while the app keeps running.
 */
const USAGE = 'usage: npm run backup -- DIR [--force]   (DATABASE_URL and S3_* as for the server)';
const OBJECT_CONCURRENCY = 4;

async function main(): Promise<number> {
  const args = parseCommandLine(process.argv.slice(2), USAGE);
  if (args === 'help') {
    process.stdout.write(`${USAGE}\n`);
    return 0;
  }
  const config = loadConfig();
  const dir = path.resolve(args.dir);
  const progress = new Progress();
  const version = (require('../package.json') as { version: string }).version;
  progress.line(`Trenchwork ${version} backup → ${dir}`);
  progress.line(`  database ${describeDatabase(config.databaseUrl)}`);
  progress.line(`  store    bucket ${config.s3.bucket}${config.s3.endpoint ? ` at ${config.s3.endpoint}` : ' (AWS S3)'}`);

  const { cleared, kept } = await prepareBackupDirectory(dir, args.force);
  if (cleared.length) progress.line(`  --force: removed the previous backup's ${cleared.join(', ')}`);
  if (kept.length) progress.line(`  left alone: ${kept.join(', ')}`);

  const createdAt = new Date();
  const client = new pg.Client({ connectionString: config.databaseUrl, connectionTimeoutMillis: 10_000 });
  const storage = createObjectStorage(config);
  try {
    await client.connect().catch((error: Error) => {
      throw new Error(`cannot connect to the database ${describeDatabase(config.databaseUrl)}: ${error.message}`);
    });
    // One snapshot for the counts and the dump: pg_dump --snapshot reads exactly what this transaction sees.
    await client.query('begin isolation level repeatable read read only');
    const snapshot = (await client.query<{ id: string }>('select pg_export_snapshot() as id')).rows[0]!.id;
    const migrations = await listMigrations(client);
    if (!migrations) throw new Error(`${describeDatabase(config.databaseUrl)} has no Trenchwork schema (no kysely_migration table): nothing to back up`);
    const tables = await listTables(client);
    const counts = await countRows(client, tables);
    const totalRows = sumRows(tables, counts);
    const postgresServer = await serverVersion(client);
    progress.step(1, 3, `database: ${tables.length} tables, ${totalRows} rows, ${migrations.length} migrations (PostgreSQL ${postgresServer})`);

    const pgDump = pgToolPath('pg_dump');
    const pgDumpVersion = (await runPgTool(pgDump, ['--version'], process.env)).trim();
    const connection = toolConnection(config.databaseUrl);
    const dumpFile = path.join(dir, DUMP_FILE);
    const dumpStarted = Date.now();
    await runPgTool(pgDump, ['--format=custom', '--no-password', `--snapshot=${snapshot}`, `--file=${dumpFile}`, `--dbname=${connection.url}`], connection.env);
    await client.query('commit');
    const dump = await hashFile(dumpFile);
    progress.line(`      ${pgDumpVersion}: ${DUMP_FILE} ${formatBytes(dump.bytes)} in ${formatSeconds(Date.now() - dumpStarted)}`);

    // Objects are listed after the snapshot: one written meanwhile is copied too (harmless), and a
    // key the dump refers to is only missing if it was deleted in between.
    const keys = (await storage.list('')).sort();
    progress.step(2, 3, `objects: ${keys.length} in bucket ${config.s3.bucket}`);
    const items: ObjectEntry[] = new Array(keys.length);
    let done = 0;
    let bytes = 0;
    const tick = progress.counter('copied', keys.length);
    await forEachLimited(keys, OBJECT_CONCURRENCY, async (key, index) => {
      items[index] = await backupObject(storage, dir, key);
      done += 1;
      bytes += items[index]!.bytes;
      tick(done, formatBytes(bytes));
    });

    const manifest: Manifest = {
      format: MANIFEST_FORMAT,
      formatVersion: MANIFEST_VERSION,
      createdAt: createdAt.toISOString(),
      durationMs: progress.elapsedMs(),
      app: { name: 'trenchwork', version },
      source: { database: describeDatabase(config.databaseUrl), bucket: config.s3.bucket, endpoint: config.s3.endpoint ?? null },
      tools: { pgDump: pgDumpVersion, postgresServer },
      database: { file: DUMP_FILE, format: 'custom', bytes: dump.bytes, sha256: dump.sha256, migrations, tables: counts, totalRows },
      objects: { count: items.length, bytes, items },
    };
    await writeManifest(dir, manifest);
    const size = dump.bytes + bytes + (await stat(path.join(dir, 'manifest.json'))).size;
    progress.step(3, 3, 'manifest.json written');
    progress.line(`Backup complete in ${formatSeconds(progress.elapsedMs())}: ${totalRows} rows in ${tables.length} tables, ${items.length} objects (${formatBytes(bytes)}); ${formatBytes(size)} in ${dir}`);
    return 0;
  } catch (error) {
    if ((await readdir(dir).catch(() => [])).length) process.stderr.write(`The backup in ${dir} is incomplete (it has no manifest.json); restore will refuse it.\n`);
    throw error;
  } finally {
    storage.destroy();
    await client.end().catch(() => undefined);
  }
}

runCommand('backup', main);
