import { HttpEventType } from '@angular/common/http';
import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { Subject, type Subscription } from 'rxjs';
import type { UploadResponse } from '@shared/api/film';
import type { Angle, ClipKind } from '@shared/film';
import { readApiError } from '../../core/http/api-error';
import { FilmApi } from './film-api';

export type UploadStatus = 'waiting' | 'sending' | 'storing' | 'received' | 'skipped' | 'refused' | 'failed' | 'cancelled';

export interface UploadItem {
  id: number;
  sessionId: number;
  file: File;
  angle: Angle;
  kind: ClipKind;
  status: UploadStatus;
  /** Bytes sent so far. */
  sent: number;
  /** Why the server skipped or refused it, or why the request failed. */
  message: string | null;
  clipId: number | null;
  /** Worth sending again (a dropped connection is; a file over the limit is not). */
  retryable: boolean;
}

const PARALLEL_UPLOADS = 2;
const RUNNING: ReadonlySet<UploadStatus> = new Set(['waiting', 'sending', 'storing']);

export function isRunning(item: UploadItem): boolean {
  return RUNNING.has(item.status);
}

/**
 * The files being sent from this page, one request per file, two at a time (the browser keeps
 * connections free for the video and the polling). Cancel unsubscribes, which aborts the request.
 */
@Injectable()
export class UploadQueue {
  private readonly api = inject(FilmApi);
  private readonly requests = new Map<number, Subscription>();
  private nextId = 1;

  readonly items = signal<readonly UploadItem[]>([]);
  /** One event per request that got an answer, so the page can fetch the new clips. */
  readonly finished = new Subject<UploadItem>();

  readonly active = computed(() => this.items().some(isRunning));
  readonly overall = computed(() => {
    const counted = this.items().filter((item) => item.status !== 'cancelled');
    const total = counted.reduce((sum, item) => sum + item.file.size, 0);
    const sent = counted.reduce((sum, item) => sum + (isRunning(item) ? Math.min(item.sent, item.file.size) : item.file.size), 0);
    return {
      files: counted.length,
      done: counted.filter((item) => !isRunning(item)).length,
      percent: total === 0 ? 100 : Math.round((sent / total) * 100),
    };
  });

  constructor() {
    inject(DestroyRef).onDestroy(() => {
      for (const request of this.requests.values()) request.unsubscribe();
      this.requests.clear();
    });
  }

  add(sessionId: number, files: readonly File[], angle: Angle, kind: ClipKind): void {
    const added = files.map<UploadItem>((file) => ({
      id: this.nextId++,
      sessionId,
      file,
      angle,
      kind,
      status: 'waiting',
      sent: 0,
      message: null,
      clipId: null,
      retryable: false,
    }));
    this.items.update((items) => [...items, ...added]);
    this.pump();
  }

  cancel(id: number): void {
    this.requests.get(id)?.unsubscribe();
    this.requests.delete(id);
    this.patch(id, { status: 'cancelled', message: 'Cancelled; nothing of this file was kept.', retryable: true });
    this.pump();
  }

  retry(id: number): void {
    this.patch(id, { status: 'waiting', sent: 0, message: null, clipId: null, retryable: false });
    this.pump();
  }

  dismiss(id: number): void {
    this.items.update((items) => items.filter((item) => item.id !== id || isRunning(item)));
  }

  clearFinished(): void {
    this.items.update((items) => items.filter(isRunning));
  }

  private pump(): void {
    const waiting = this.items().filter((item) => item.status === 'waiting' && !this.requests.has(item.id));
    const free = PARALLEL_UPLOADS - this.requests.size;
    for (const item of waiting.slice(0, Math.max(0, free))) this.send(item);
  }

  private send(item: UploadItem): void {
    this.patch(item.id, { status: 'sending', sent: 0 });
    const request = this.api.upload(item.sessionId, item.file, item.angle, item.kind).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress) {
          const all = event.total ?? item.file.size;
          this.patch(item.id, { sent: event.loaded, status: event.loaded >= all ? 'storing' : 'sending' });
        } else if (event.type === HttpEventType.Response && event.body) {
          this.patch(item.id, outcomeOf(event.body));
          this.done(item.id);
        }
      },
      error: (failure: unknown) => {
        const error = readApiError(failure);
        // Over the size limit or refused as bad input: sending the same file again cannot help.
        const retryable = error.status !== 413 && error.status !== 422 && error.status !== 403 && error.status !== 404;
        this.patch(item.id, { status: 'failed', message: error.message, retryable });
        this.done(item.id);
      },
    });
    this.requests.set(item.id, request);
  }

  private done(id: number): void {
    this.requests.delete(id);
    const item = this.items().find((i) => i.id === id);
    if (item) this.finished.next(item);
    this.pump();
  }

  private patch(id: number, change: Partial<UploadItem>): void {
    this.items.update((items) => items.map((item) => (item.id === id ? { ...item, ...change } : item)));
  }
}

/** What the server did with a file sent alone. */
function outcomeOf(response: UploadResponse): Partial<UploadItem> {
  const skipped = response.skipped[0];
  if (skipped) return { status: 'skipped', message: `Skipped: ${skipped.reason}.`, clipId: skipped.duplicateOfClipId ?? null };
  const clip = response.clips[0];
  if (!clip) return { status: 'failed', message: 'The server kept nothing of this file.', retryable: true };
  if (clip.status === 'failed') return { status: 'refused', clipId: clip.id, message: null };
  return { status: 'received', clipId: clip.id, message: null };
}
