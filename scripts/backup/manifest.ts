import { readFile, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { z } from 'zod';

/**
 * manifest.json: what a backup holds and how to check it. Written last (through a temporary file
 * and a rename), so a folder without it is an unfinished backup and restore refuses it.
 */
export const MANIFEST_FILE = 'manifest.json';
export const DUMP_FILE = 'database.dump';
export const MANIFEST_FORMAT = 'trenchwork-backup';
export const MANIFEST_VERSION = 1;

const sha256 = z.string().regex(/^[0-9a-f]{64}$/);
const count = z.number().int().min(0);

export const manifestSchema = z.object({
  format: z.literal(MANIFEST_FORMAT),
  formatVersion: z.literal(MANIFEST_VERSION),
  createdAt: z.iso.datetime(),
  durationMs: count,
  app: z.object({ name: z.string(), version: z.string() }),
  source: z.object({ database: z.string(), bucket: z.string(), endpoint: z.string().nullable() }),
  tools: z.object({ pgDump: z.string(), postgresServer: z.string() }),
  database: z.object({
    file: z.literal(DUMP_FILE),
    format: z.literal('custom'),
    bytes: count,
    sha256,
    migrations: z.array(z.string()),
    /** Rows per table ("schema.table"), counted in the snapshot pg_dump read. */
    tables: z.record(z.string(), count),
    totalRows: count,
  }),
  objects: z.object({
    count,
    bytes: count,
    items: z.array(z.object({ key: z.string().min(1), file: z.string().min(1), bytes: count, sha256, contentType: z.string().nullable() })),
  }),
});
export type Manifest = z.infer<typeof manifestSchema>;
export type ObjectEntry = Manifest['objects']['items'][number];

export async function writeManifest(dir: string, manifest: Manifest): Promise<void> {
  const target = path.join(dir, MANIFEST_FILE);
  const temporary = `${target}.partial`;
  await writeFile(temporary, `${JSON.stringify(manifest, null, 2)}\n`, { flag: 'w' });
  await rename(temporary, target);
}

export async function readManifest(dir: string): Promise<Manifest> {
  const file = path.join(dir, MANIFEST_FILE);
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new Error(`${file} is missing: not a Trenchwork backup, or an unfinished one`);
    throw error;
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new Error(`${file} is not valid JSON`);
  }
  const parsed = manifestSchema.safeParse(json);
  if (!parsed.success) {
    const issues = parsed.error.issues.slice(0, 8).map((i) => `  ${i.path.join('.') || '(root)'}: ${i.message}`);
    throw new Error(`${file} is not a manifest this version understands:\n${issues.join('\n')}`);
  }
  const manifest = parsed.data;
  if (manifest.objects.items.length !== manifest.objects.count) throw new Error(`${file}: objects.count says ${manifest.objects.count} but ${manifest.objects.items.length} are listed`);
  if (new Set(manifest.objects.items.map((i) => i.key)).size !== manifest.objects.items.length) throw new Error(`${file} lists an object key twice`);
  return manifest;
}
