import { mergeWatched } from '@shared/film-room';

/** Two readings further apart than this were a seek (or a loop wrapping), not playback. */
const MAX_GAP_MS = 1500;

/**
 * Turns the player's position readings into the stretches actually played. Readings while paused
 * (scrubbing, frame steps) count for nothing; a jump ends one stretch and starts the next.
 */
export class WatchTracker {
  private from: number | null = null;
  private to = 0;
  private done: [number, number][] = [];
  private playing = false;

  play(atMs: number): void {
    this.playing = true;
    this.close();
    this.from = atMs;
    this.to = atMs;
  }

  time(ms: number): void {
    if (!this.playing) return;
    if (this.from === null) {
      this.from = ms;
      this.to = ms;
    } else if (ms >= this.to && ms - this.to <= MAX_GAP_MS) {
      this.to = ms;
    } else {
      this.close();
      this.from = ms;
      this.to = ms;
    }
  }

  pause(atMs?: number): void {
    if (atMs !== undefined) this.time(atMs);
    this.close();
    this.playing = false;
  }

  /** Everything played since the last take, merged, in whole ms; a stretch still playing goes on from here. */
  take(): [number, number][] {
    const open = this.from !== null && this.playing ? this.to : null;
    this.close();
    if (open !== null) {
      this.from = open;
      this.to = open;
    }
    const ranges = mergeWatched(this.done, Number.MAX_SAFE_INTEGER).ranges.map(([a, b]) => [Math.round(a), Math.round(b)] as [number, number]);
    this.done = [];
    return ranges.filter(([a, b]) => b > a);
  }

  /** Stretches that could not be sent go back, to be sent with the next ones. */
  putBack(ranges: readonly [number, number][]): void {
    this.done.push(...ranges);
  }

  private close(): void {
    if (this.from !== null && this.to > this.from) this.done.push([this.from, this.to]);
    this.from = null;
  }
}
