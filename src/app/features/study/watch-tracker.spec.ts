import { of, throwError } from 'rxjs';
import { ViewReporter } from './view-reporter';
import { WatchTracker } from './watch-tracker';

describe('WatchTracker', () => {
  it('counts only what played, splitting at seeks and ignoring scrubbing while paused', () => {
    const t = new WatchTracker();
    t.time(500); // paused: scrubbing counts for nothing
    t.play(1000);
    for (const ms of [1250, 1500, 1750, 2000]) t.time(ms);
    t.time(6000); // a jump forward: a seek
    t.time(6250);
    t.time(6500);
    t.pause();
    expect(t.take()).toEqual([
      [1000, 2000],
      [6000, 6500],
    ]);
    expect(t.take()).toEqual([]);
  });

  it('merges a replay with what was seen before and keeps a stretch that is still playing open', () => {
    const t = new WatchTracker();
    t.play(0);
    t.time(1000);
    t.time(2000);
    t.time(500); // back: a replay of a moment already counted
    t.time(1500);
    expect(t.take()).toEqual([[0, 2000]]);
    t.time(2500);
    t.pause(3000);
    expect(t.take()).toEqual([[1500, 3000]]);
  });

  it('keeps stretches given back after a failed send for the next take', () => {
    const t = new WatchTracker();
    t.putBack([[100, 900]]);
    t.play(1000);
    t.pause(1800);
    expect(t.take()).toEqual([[100, 900], [1000, 1800]]);
  });
});

describe('ViewReporter', () => {
  beforeEach(() => jest.useFakeTimers());
  afterEach(() => jest.useRealTimers());

  it('reports every 5 s while playing and on pause, and sends a failed stretch again later', () => {
    const sent: [number, number][] = [];
    let failNext = false;
    const reporter = new ViewReporter((from, to) => {
      sent.push([from, to]);
      if (failNext) {
        failNext = false;
        return throwError(() => new Error('offline'));
      }
      return of({ watchedFraction: 0.5 });
    });
    reporter.playing(0);
    for (let ms = 250; ms <= 5000; ms += 250) reporter.time(ms);
    failNext = true;
    jest.advanceTimersByTime(5000);
    expect(sent).toEqual([[0, 5000]]);

    reporter.time(5250);
    reporter.paused(5500);
    // The failed stretch goes again with the new one.
    expect(sent.slice(1)).toEqual([[0, 5500]]);

    jest.advanceTimersByTime(30000);
    expect(sent).toHaveLength(2);
    reporter.stop();
  });

  it('retries on its own when nothing else happens after a failure', () => {
    let attempts = 0;
    const reporter = new ViewReporter(() => (++attempts === 1 ? throwError(() => new Error('offline')) : of({ watchedFraction: 1 })));
    reporter.playing(0);
    reporter.time(1000);
    reporter.paused(1200);
    expect(attempts).toBe(1);
    jest.advanceTimersByTime(15000);
    expect(attempts).toBe(2);
    jest.advanceTimersByTime(60000);
    expect(attempts).toBe(2);
    reporter.stop();
  });
});
