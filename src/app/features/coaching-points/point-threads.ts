import type { Comment } from '@shared/api/film-room';
import type { PointMarker } from './point-markers';

/** A point made at one moment stays "now" for this long after it while the video plays. */
const MOMENT_WINDOW_MS = 2000;

/** Threads in the order of the clip: by moment, then by when they were written. */
export function threadsInOrder(comments: readonly Comment[]): Comment[] {
  return comments.filter((c) => c.parentId === null).sort((a, b) => a.atMs - b.atMs || a.createdAt.localeCompare(b.createdAt) || a.id - b.id);
}

/** Removed points leave no mark on the clip. */
export function toMarkers(threads: readonly Comment[]): PointMarker[] {
  return threads.filter((t) => !t.hidden).map((t) => ({ id: t.id, atMs: t.atMs, endMs: t.endMs, kind: t.kind, text: t.body }));
}

/** The point the video is at now: the latest one that started and has not ended. */
export function activePointId(threads: readonly Comment[], timeMs: number): number | null {
  let found: number | null = null;
  for (const t of threads) {
    if (t.hidden || t.atMs > timeMs) continue;
    const end = t.endMs !== null && t.endMs > t.atMs ? t.endMs : t.atMs + MOMENT_WINDOW_MS;
    if (timeMs <= end) found = t.id;
  }
  return found;
}
