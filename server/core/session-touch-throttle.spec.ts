import { TouchThrottle } from './session-touch-throttle';

describe('TouchThrottle', () => {
  let nowMs: number;
  const clock = () => new Date(nowMs);
  beforeEach(() => {
    nowMs = Date.UTC(2026, 8, 25, 18, 0, 0);
  });

  test('a session written less than the interval ago is fresh; at the interval it is stale', () => {
    const throttle = new TouchThrottle(clock, 60_000);
    expect(throttle.isFresh('a')).toBe(false);
    throttle.written('a');
    nowMs += 59_999;
    expect(throttle.isFresh('a')).toBe(true);
    nowMs += 1;
    expect(throttle.isFresh('a')).toBe(false);
    // A stale entry is dropped, not kept around.
    expect(throttle.size).toBe(0);
  });

  test('a clock moved backwards counts as stale, so the store is written rather than skipped', () => {
    const throttle = new TouchThrottle(clock, 60_000);
    throttle.written('a');
    nowMs -= 1;
    expect(throttle.isFresh('a')).toBe(false);
  });

  test('forget (a destroyed session) makes the next touch write', () => {
    const throttle = new TouchThrottle(clock, 60_000);
    throttle.written('a');
    throttle.forget('a');
    expect(throttle.isFresh('a')).toBe(false);
  });

  test('past its capacity it forgets the least recently written session', () => {
    const throttle = new TouchThrottle(clock, 60_000, 2);
    throttle.written('a');
    throttle.written('b');
    throttle.written('a'); // now b is the oldest
    throttle.written('c');
    expect(throttle.size).toBe(2);
    expect(throttle.isFresh('b')).toBe(false);
    expect(throttle.isFresh('a')).toBe(true);
    expect(throttle.isFresh('c')).toBe(true);
  });
});
