import type { Observable } from 'rxjs';
import { WatchTracker } from './watch-tracker';

const REPORT_EVERY_MS = 5000;
const RETRY_AFTER_MS = 15000;

export type SendView = (fromMs: number, toMs: number) => Observable<{ watchedFraction: number }>;

/**
 * Reports the stretches a player watched: every few seconds while playing, and on pause or end.
 * A failed report is kept and sent again later; the player never sees an error for it.
 */
export class ViewReporter {
  private readonly tracker = new WatchTracker();
  private ticking: ReturnType<typeof setInterval> | null = null;
  private retrying: ReturnType<typeof setTimeout> | null = null;

  constructor(
    private readonly send: SendView,
    private readonly onWatched: (fraction: number) => void = () => undefined,
  ) {}

  playing(atMs: number): void {
    this.tracker.play(atMs);
    this.ticking ??= setInterval(() => this.flush(), REPORT_EVERY_MS);
  }

  time(ms: number): void {
    this.tracker.time(ms);
  }

  paused(atMs?: number): void {
    this.tracker.pause(atMs);
    this.stopTicking();
    this.flush();
  }

  flush(): void {
    for (const [fromMs, toMs] of this.tracker.take()) {
      this.send(fromMs, toMs).subscribe({
        next: (answer) => {
          // The number is a nicety for the screen; a body without it changes nothing.
          if (typeof answer?.watchedFraction === 'number') this.onWatched(answer.watchedFraction);
        },
        error: () => {
          this.tracker.putBack([[fromMs, toMs]]);
          this.retrying ??= setTimeout(() => {
            this.retrying = null;
            this.flush();
          }, RETRY_AFTER_MS);
        },
      });
    }
  }

  /** Leaving the clip: send what is left once more, then stop all timers. */
  stop(): void {
    this.tracker.pause();
    this.stopTicking();
    if (this.retrying !== null) clearTimeout(this.retrying);
    this.retrying = null;
    const last = this.tracker.take();
    for (const [fromMs, toMs] of last) this.send(fromMs, toMs).subscribe({ error: () => undefined });
  }

  private stopTicking(): void {
    if (this.ticking !== null) clearInterval(this.ticking);
    this.ticking = null;
  }
}
