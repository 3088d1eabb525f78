/** A touch within this long of the last write of a session's expiry is skipped. */
export const TOUCH_INTERVAL_MS = 60_000;
/** Sessions remembered per process. Past it the least recently written is forgotten, and merely touched again next time. */
export const TOUCH_MEMORY = 10_000;

/**
 * When this process last wrote each session's stored expiry (a save or a touch), so the store can
 * skip touches that would move it by less than TOUCH_INTERVAL_MS. Per process: another API process
 * keeps its own and touches at most once a minute itself.
 */
export class TouchThrottle {
  private readonly writtenAt = new Map<string, number>();

  constructor(
    private readonly now: () => Date,
    private readonly intervalMs = TOUCH_INTERVAL_MS,
    private readonly capacity = TOUCH_MEMORY,
  ) {}

  /** True while the last write is less than the interval old. A clock moved backwards counts as stale. */
  isFresh(sid: string): boolean {
    const at = this.writtenAt.get(sid);
    if (at === undefined) return false;
    const elapsed = this.now().getTime() - at;
    if (elapsed >= 0 && elapsed < this.intervalMs) return true;
    this.writtenAt.delete(sid);
    return false;
  }

  written(sid: string): void {
    // Deleted first so the entry moves to the end: a Map iterates in insertion order, oldest first.
    this.writtenAt.delete(sid);
    this.writtenAt.set(sid, this.now().getTime());
    if (this.writtenAt.size > this.capacity) {
      const oldest = this.writtenAt.keys().next().value;
      if (oldest !== undefined) this.writtenAt.delete(oldest);
    }
  }

  forget(sid: string): void {
    this.writtenAt.delete(sid);
  }

  get size(): number {
    return this.writtenAt.size;
  }
}
