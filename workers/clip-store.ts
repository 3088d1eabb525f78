import { createWriteStream } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { pipeline } from 'node:stream/promises';
import type { Readable } from 'node:stream';
import type { Database } from '../db/database';
import type { ObjectStorage } from '../server/core/storage';

/** Clip row updates and object transfers shared by the clip jobs. */
export async function downloadObject(storage: ObjectStorage, key: string, path: string): Promise<void> {
  const object = await storage.get(key);
  await pipeline(object.Body as Readable, createWriteStream(path));
}

export async function uploadFile(storage: ObjectStorage, key: string, path: string, contentType: string): Promise<void> {
  // Derived files are small (posters, strips) or bounded renditions: read and put them whole.
  const { done } = storage.upload(key, await readFile(path), contentType);
  await done;
}

export async function setProgress(db: Database, clipId: number, progress: number): Promise<void> {
  await db.updateTable('clips').set({ progress, updated_at: new Date() }).where('id', '=', clipId).execute();
}

export async function markFailed(db: Database, clipId: number, reason: string): Promise<void> {
  await db.updateTable('clips').set({ status: 'failed', failure_reason: reason, updated_at: new Date() }).where('id', '=', clipId).execute();
}

export function loadClip(db: Database, clipId: number) {
  return db
    .selectFrom('clips')
    .select(['id', 'team_id', 'session_id', 'snap_id', 'kind', 'angle', 'status', 'original_key', 'duration_ms', 'width', 'height', 'fps', 'source_clip_id', 'failure_reason'])
    .where('id', '=', clipId)
    .executeTakeFirst();
}
