import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/**
 * Runs fn in a fresh private directory (mode 0700) and always removes it afterwards, also when fn
 * throws: one directory per job, so an aborted job leaves no stray media on the worker.
 */
export async function withTempDir<T>(fn: (dir: string) => Promise<T>, options: { parent?: string; prefix?: string } = {}): Promise<T> {
  const dir = await mkdtemp(join(options.parent ?? tmpdir(), options.prefix ?? 'trenchwork-media-'));
  try {
    return await fn(dir);
  } finally {
    await rm(dir, { recursive: true, force: true, maxRetries: 3 });
  }
}
