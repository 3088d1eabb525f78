import { HttpErrorResponse } from '@angular/common/http';
import { DestroyRef, Injectable, InjectionToken, computed, inject, signal } from '@angular/core';
import type { Grade } from '@shared/api/grading';
import { AuthStore } from '../../core/auth/auth-store';
import { readApiError } from '../../core/http/api-error';
import { blankDraft, draftFromGrade, sameDraft, type GradeDraft } from './grade-draft';
import { GradingApi } from './grading-api';
import { QueuedGrade, gradeKey, readQueue, writeQueue } from './queued-grade';

/** How long a row rests after a key before it is saved: quick keys on one row make one PUT. */
export const GRADE_SAVE_DELAY_MS = new InjectionToken<number>('GRADE_SAVE_DELAY_MS', { factory: () => 700 });
/** First wait after the server could not be reached; doubles each time up to a minute. */
export const GRADE_RETRY_BASE_MS = new InjectionToken<number>('GRADE_RETRY_BASE_MS', { factory: () => 2000 });
const RETRY_MAX_MS = 60_000;

export type RowSaveState = 'empty' | 'saved' | 'unsaved' | 'saving' | 'offline' | 'conflict' | 'failed' | 'locked';
/** online: saving normally · offline: the server did not answer, retrying · signed-out: waits for sign-in. */
export type QueueMode = 'online' | 'offline' | 'signed-out';

/**
 * Every grade change goes through here: kept in storage at once, PUT after a short rest, one at a
 * time in the order made. When the server cannot be reached the changes wait and are retried with
 * backoff (and at once when the browser says it is online again). A newer grade on the server
 * (409) is held for the coach to choose.
 */
@Injectable({ providedIn: 'root' })
export class GradeSaveQueue {
  private readonly api = inject(GradingApi);
  private readonly auth = inject(AuthStore);
  private readonly delay = inject(GRADE_SAVE_DELAY_MS);
  private readonly retryBase = inject(GRADE_RETRY_BASE_MS);

  private readonly queue = signal<readonly QueuedGrade[]>([]);
  private readonly known = signal<ReadonlyMap<string, Grade>>(new Map());
  private readonly locked = signal<ReadonlySet<number>>(new Set());
  readonly mode = signal<QueueMode>('online');
  /** When the next retry runs while offline (ms since epoch). */
  readonly retryAt = signal<number | null>(null);
  /** False when the browser refuses storage: changes then survive only while the tab is open. */
  readonly storageWorks = signal(true);
  /** Counts successful saves, so pages can refresh figures that depend on them. */
  readonly savedCount = signal(0);

  readonly entries = this.queue.asReadonly();
  readonly byKey = computed(() => new Map(this.queue().map((e) => [gradeKey(e.snapId, e.playerId), e])));

  private userId: number | null = null;
  private busy = false;
  private failures = 0;
  private pausedUntil = 0;
  private timer: ReturnType<typeof setTimeout> | null = null;

  constructor() {
    const online = () => this.retryNow();
    window.addEventListener('online', online);
    inject(DestroyRef).onDestroy(() => {
      window.removeEventListener('online', online);
      if (this.timer) clearTimeout(this.timer);
    });
  }

  /** Loads what the signed-in coach left in this browser and starts sending it. */
  start(): void {
    const userId = this.auth.user()?.id ?? null;
    if (userId !== this.userId) {
      this.userId = userId;
      this.queue.set(userId === null ? [] : readQueue(userId));
      this.known.set(new Map());
      this.failures = 0;
      this.pausedUntil = 0;
      this.mode.set('online');
    }
    if (this.mode() === 'signed-out') this.mode.set('online');
    this.retryNow();
  }

  /** Grades as the server sent them with the desk; a newer copy saved here meanwhile wins. */
  absorb(grades: readonly Grade[]): void {
    this.known.update((map) => {
      const next = new Map(map);
      for (const grade of grades) {
        const key = gradeKey(grade.snapId, grade.playerId);
        const held = next.get(key);
        if (!held || held.version <= grade.version) next.set(key, grade);
      }
      return next;
    });
  }

  setLocked(sessionId: number, isLocked: boolean): void {
    this.locked.update((set) => {
      const next = new Set(set);
      if (isLocked) next.add(sessionId);
      else next.delete(sessionId);
      return next;
    });
    if (!isLocked) this.retryNow();
  }

  isLocked(sessionId: number): boolean {
    return this.locked().has(sessionId);
  }

  serverGrade(snapId: number, playerId: number): Grade | null {
    return this.known().get(gradeKey(snapId, playerId)) ?? null;
  }

  /** What the grid shows: the coach's unsent change over the server's grade. */
  draftFor(snapId: number, playerId: number): GradeDraft {
    const key = gradeKey(snapId, playerId);
    const entry = this.byKey().get(key);
    if (entry) return entry.draft;
    const grade = this.known().get(key);
    return grade ? draftFromGrade(grade) : blankDraft();
  }

  rowState(sessionId: number, snapId: number, playerId: number): RowSaveState {
    const key = gradeKey(snapId, playerId);
    const entry = this.byKey().get(key);
    if (!entry) return this.known().has(key) ? 'saved' : 'empty';
    if (entry.state === 'conflict' || entry.state === 'failed') return entry.state;
    if (this.locked().has(sessionId)) return 'locked';
    if (entry.state === 'sending') return 'saving';
    return this.mode() === 'online' ? 'unsaved' : 'offline';
  }

  /** Records a change to one row; it is stored now and sent after the rest delay. */
  edit(sessionId: number, snapId: number, playerId: number, draft: GradeDraft): void {
    const key = gradeKey(snapId, playerId);
    const entry = this.byKey().get(key);
    const server = this.known().get(key);
    const now = Date.now();
    if (entry) {
      // Back to exactly what the server holds: nothing left to send.
      if (entry.state === 'waiting' && server && server.version === entry.version && sameDraft(draftFromGrade(server), draft)) {
        this.replace(this.queue().filter((e) => e !== entry));
        return;
      }
      const state = entry.state === 'failed' ? 'waiting' : entry.state;
      this.replace(this.queue().map((e) => (e === entry ? { ...e, draft, state, dueAt: now + this.delay, message: undefined } : e)));
    } else {
      if (sameDraft(server ? draftFromGrade(server) : blankDraft(), draft)) return;
      const seq = this.queue().reduce((max, e) => Math.max(max, e.seq), 0) + 1;
      this.replace([...this.queue(), { seq, sessionId, snapId, playerId, draft, version: server?.version ?? 0, dueAt: now + this.delay, state: 'waiting' }]);
    }
    this.schedule();
  }

  /** Conflict: send the coach's value again, this time over the server's newer version. */
  keepMine(snapId: number, playerId: number): void {
    const entry = this.byKey().get(gradeKey(snapId, playerId));
    if (!entry?.current) return;
    const version = entry.current.version;
    this.replace(this.queue().map((e) => (e === entry ? { ...e, version, state: 'waiting', current: undefined, dueAt: 0 } : e)));
    this.retryNow();
  }

  /** Conflict: drop the coach's change and show the server's grade. */
  takeTheirs(snapId: number, playerId: number): void {
    const entry = this.byKey().get(gradeKey(snapId, playerId));
    if (!entry?.current) return;
    const current = entry.current;
    this.known.update((map) => new Map(map).set(gradeKey(snapId, playerId), current));
    this.replace(this.queue().filter((e) => e !== entry));
  }

  /** A change the server refused for good (422, 403): let it go. */
  discard(snapId: number, playerId: number): void {
    const entry = this.byKey().get(gradeKey(snapId, playerId));
    if (entry && entry.state !== 'sending') this.replace(this.queue().filter((e) => e !== entry));
  }

  /** Try the waiting changes now (a retry button, the browser's online event, an unlock). */
  retryNow(): void {
    this.pausedUntil = 0;
    this.retryAt.set(null);
    this.pump();
  }

  private replace(entries: readonly QueuedGrade[]): void {
    this.queue.set(entries);
    if (this.userId !== null) this.storageWorks.set(writeQueue(this.userId, entries));
  }

  private update(seq: number, change: (entry: QueuedGrade) => QueuedGrade | null): void {
    const next: QueuedGrade[] = [];
    for (const entry of this.queue()) {
      if (entry.seq !== seq) next.push(entry);
      else {
        const changed = change(entry);
        if (changed) next.push(changed);
      }
    }
    this.replace(next);
  }

  private sendable(): QueuedGrade[] {
    const locked = this.locked();
    return this.queue().filter((e) => e.state === 'waiting' && !locked.has(e.sessionId));
  }

  private schedule(): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    if (this.busy || this.mode() === 'signed-out') return;
    const waiting = this.sendable();
    if (waiting.length === 0) return;
    const at = Math.max(this.pausedUntil, Math.min(...waiting.map((e) => e.dueAt)));
    this.timer = setTimeout(() => this.pump(), Math.max(0, at - Date.now()));
  }

  private pump(): void {
    if (this.busy || this.mode() === 'signed-out' || this.userId === null) return;
    const now = Date.now();
    if (now < this.pausedUntil) return this.schedule();
    // In order: the first change not still resting goes first.
    const entry = this.sendable().find((e) => e.dueAt <= now);
    if (!entry) return this.schedule();
    this.busy = true;
    const sent = entry.draft;
    this.update(entry.seq, (e) => ({ ...e, state: 'sending', sent }));
    this.api.saveGrade(entry.snapId, entry.playerId, { ...sent, version: entry.version }).subscribe({
      next: (grade) => this.saved(entry.seq, sent, grade),
      error: (failure: unknown) => this.failed(entry.seq, failure),
    });
  }

  private saved(seq: number, sent: GradeDraft, grade: Grade): void {
    this.busy = false;
    this.failures = 0;
    this.mode.set('online');
    this.retryAt.set(null);
    this.known.update((map) => new Map(map).set(gradeKey(grade.snapId, grade.playerId), grade));
    // Typed more while the save was on its way: keep that change, now over the new version.
    this.update(seq, (e) => (sameDraft(e.draft, sent) ? null : { ...e, state: 'waiting', version: grade.version, sent: undefined }));
    this.savedCount.update((n) => n + 1);
    this.pump();
  }

  private failed(seq: number, failure: unknown): void {
    this.busy = false;
    const status = failure instanceof HttpErrorResponse ? failure.status : 0;
    const error = readApiError(failure);
    if (status === 0 || status === 408 || status === 429 || status >= 500) {
      // The server is away: keep everything in order and try again later.
      this.failures += 1;
      const wait = Math.min(RETRY_MAX_MS, this.retryBase * 2 ** (this.failures - 1));
      this.pausedUntil = Date.now() + wait;
      this.retryAt.set(this.pausedUntil);
      this.mode.set('offline');
      this.update(seq, (e) => ({ ...e, state: 'waiting', sent: undefined }));
      return this.schedule();
    }
    if (status === 401) {
      // The interceptor sends the coach to sign in; the change stays stored for his return.
      this.mode.set('signed-out');
      this.update(seq, (e) => ({ ...e, state: 'waiting', sent: undefined }));
      return;
    }
    const current = status === 409 && error.code === 'stale_version' ? readCurrent(failure) : null;
    if (current) {
      this.update(seq, (e) => ({ ...e, state: 'conflict', current, sent: undefined }));
    } else if (status === 409) {
      // Grading of the session was locked meanwhile: the change waits for an unlock.
      const entry = this.queue().find((e) => e.seq === seq);
      this.update(seq, (e) => ({ ...e, state: 'waiting', sent: undefined, message: error.message }));
      if (entry) this.setLocked(entry.sessionId, true);
    } else {
      this.update(seq, (e) => ({ ...e, state: 'failed', sent: undefined, message: error.message }));
    }
    this.pump();
  }
}

function readCurrent(failure: unknown): Grade | null {
  const body = failure instanceof HttpErrorResponse ? (failure.error as { error?: { current?: unknown } } | null) : null;
  const current = body?.error?.current as Grade | undefined;
  return current && typeof current === 'object' && typeof current.version === 'number' ? current : null;
}
