import { createReadStream } from 'node:fs';
import { mkdir, open, rm, type FileHandle } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { ObjectStorage } from '../../server/core/storage';
import { HashingPassThrough, hashStream } from './hashing';
import type { ObjectEntry } from './manifest';
import { hashedObjectFileFor, objectFileFor, resolveObjectFile } from './object-paths';

/** Errors that mean "this path is taken or cannot exist here", not "the disk is broken". */
const PATH_CONFLICTS = new Set(['EEXIST', 'ENOTDIR', 'EISDIR', 'ENAMETOOLONG']);
const ATTEMPTS = 3;

async function createExclusive(backupDir: string, file: string): Promise<FileHandle> {
  const target = path.join(backupDir, ...file.split('/'));
  await mkdir(path.dirname(target), { recursive: true });
  // 'wx': never overwrite; two keys that map to one file (or one that differs only in case on a
  // case-insensitive disk) are caught here instead of silently sharing it.
  return open(target, 'wx');
}

async function openObjectFile(backupDir: string, key: string): Promise<{ file: string; handle: FileHandle }> {
  const natural = objectFileFor(key);
  try {
    return { file: natural, handle: await createExclusive(backupDir, natural) };
  } catch (error) {
    if (!PATH_CONFLICTS.has((error as NodeJS.ErrnoException).code ?? '')) throw error;
    const hashed = hashedObjectFileFor(key);
    return { file: hashed, handle: await createExclusive(backupDir, hashed) };
  }
}

/** Streams one object into the backup, hashing on the way; retried whole on a broken stream. */
export async function backupObject(storage: ObjectStorage, backupDir: string, key: string): Promise<ObjectEntry> {
  for (let attempt = 1; ; attempt += 1) {
    const { file, handle } = await openObjectFile(backupDir, key);
    try {
      const object = await storage.get(key);
      const body = object.Body as Readable | undefined;
      if (!body) throw new Error(`object ${key} came back without a body`);
      const hasher = new HashingPassThrough();
      await pipeline(body, hasher, handle.createWriteStream());
      if (object.ContentLength !== undefined && hasher.bytes !== Number(object.ContentLength)) {
        throw new Error(`object ${key}: read ${hasher.bytes} bytes, the store announced ${object.ContentLength}`);
      }
      return { key, file, bytes: hasher.bytes, sha256: hasher.digest(), contentType: object.ContentType ?? null };
    } catch (error) {
      await handle.close().catch(() => undefined);
      await rm(path.join(backupDir, ...file.split('/')), { force: true });
      if (attempt >= ATTEMPTS) throw new Error(`could not copy object ${key}: ${(error as Error).message}`);
    }
  }
}

/**
 * Uploads one object from the backup and proves it: the bytes sent must hash to the manifest's
 * SHA-256, and so must the bytes the store hands back afterwards.
 */
export async function restoreObject(storage: ObjectStorage, backupDir: string, item: ObjectEntry): Promise<void> {
  const file = await resolveObjectFile(backupDir, item.file);
  for (let attempt = 1; ; attempt += 1) {
    try {
      const source = createReadStream(file);
      const hasher = new HashingPassThrough();
      source.once('error', (error) => hasher.destroy(error));
      source.pipe(hasher);
      await storage.upload(item.key, hasher, item.contentType ?? 'application/octet-stream').done;
      const sent = hasher.digest();
      if (sent !== item.sha256 || hasher.bytes !== item.bytes) throw new MismatchError(`object ${item.key}: the file in the backup changed while it was uploaded (SHA-256 ${sent})`);
      const stored = await storage.get(item.key);
      const back = await hashStream(stored.Body as Readable);
      if (back.sha256 !== item.sha256 || back.bytes !== item.bytes) {
        throw new MismatchError(`object ${item.key}: the store returned ${back.bytes} bytes with SHA-256 ${back.sha256}, the manifest says ${item.bytes} bytes, ${item.sha256}`);
      }
      return;
    } catch (error) {
      if (error instanceof MismatchError) throw error;
      if (attempt >= ATTEMPTS) throw new Error(`could not upload object ${item.key}: ${(error as Error).message}`);
    }
  }
}

/** The store or the backup holds different bytes than the manifest: retrying will not help. */
export class MismatchError extends Error {}
