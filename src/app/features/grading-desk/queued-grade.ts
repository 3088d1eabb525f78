import type { Grade } from '@shared/api/grading';
import type { GradeDraft } from './grade-draft';

/**
 * A grade change on its way to the server. It is written to this browser's storage the moment the
 * coach makes it, so a reload, a crash or a dead connection never loses it.
 */
export interface QueuedGrade {
  /** Sending order: the order the coach first changed the rows in. */
  seq: number;
  sessionId: number;
  snapId: number;
  playerId: number;
  draft: GradeDraft;
  /** The grade version the coach last saw; sent with the PUT so a newer grade is never overwritten. */
  version: number;
  /** Not sent before this time (ms): quick keys on one row make one save. */
  dueAt: number;
  state: 'waiting' | 'sending' | 'conflict' | 'failed';
  /** The body in flight, to tell whether the coach changed the row meanwhile. */
  sent?: GradeDraft;
  /** The newer grade the server holds (after 409 stale_version). */
  current?: Grade;
  message?: string;
}

export function gradeKey(snapId: number, playerId: number): string {
  return `${snapId}:${playerId}`;
}

export function queueStorageKey(userId: number): string {
  return `trenchwork.gradeQueue.v1.u${userId}`;
}

/** Reads the queue a reload left behind; what was in flight is sent again (the version guards it). */
export function readQueue(userId: number): QueuedGrade[] {
  try {
    const raw = JSON.parse(localStorage.getItem(queueStorageKey(userId)) ?? '[]') as unknown;
    if (!Array.isArray(raw)) return [];
    return raw
      .filter((e): e is QueuedGrade => typeof e === 'object' && e !== null && Number.isInteger(e.snapId) && Number.isInteger(e.playerId) && typeof e.draft === 'object')
      .map((e) => ({ ...e, state: e.state === 'sending' ? 'waiting' : e.state, sent: undefined, dueAt: 0 }))
      .sort((a, b) => a.seq - b.seq);
  } catch {
    return [];
  }
}

/** False when the browser refuses storage (private mode, full disk). */
export function writeQueue(userId: number, entries: readonly QueuedGrade[]): boolean {
  try {
    const key = queueStorageKey(userId);
    if (entries.length === 0) localStorage.removeItem(key);
    else localStorage.setItem(key, JSON.stringify(entries.map(({ sent: _sent, ...rest }) => ({ ...rest, state: rest.state === 'sending' ? 'waiting' : rest.state }))));
    return true;
  } catch {
    return false;
  }
}
