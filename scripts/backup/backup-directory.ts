import { mkdir, readdir, rm } from 'node:fs/promises';
import path from 'node:path';
import { DUMP_FILE, MANIFEST_FILE } from './manifest';
import { OBJECTS_DIR } from './object-paths';

/**
 * The backup's target folder: created when missing; refused when it holds anything, unless --force.
 * --force removes only what a backup writes (manifest.json, database.dump, objects/) and leaves any
 * other file alone, so a mistyped path cannot wipe an unrelated folder.
 */
const OWN_ENTRIES = [MANIFEST_FILE, `${MANIFEST_FILE}.partial`, DUMP_FILE, OBJECTS_DIR];

export async function prepareBackupDirectory(dir: string, force: boolean): Promise<{ cleared: string[]; kept: string[] }> {
  await mkdir(dir, { recursive: true });
  const entries = await readdir(dir);
  if (entries.length === 0) return { cleared: [], kept: [] };
  if (!force) {
    const shown = entries.slice(0, 5).join(', ') + (entries.length > 5 ? `, … (${entries.length} entries)` : '');
    throw new Error(`${dir} is not empty (${shown}). Choose an empty or new directory, or pass --force to replace the backup in it.`);
  }
  const cleared = entries.filter((e) => OWN_ENTRIES.includes(e));
  for (const entry of cleared) await rm(path.join(dir, entry), { recursive: true, force: true });
  return { cleared, kept: entries.filter((e) => !OWN_ENTRIES.includes(e)) };
}
