import { assertCount } from './counts';
import { Z95 } from './normal';

export type Interval = [low: number, high: number];

/**
 * Wilson score interval for a proportion (Wilson 1927; method 3 in Newcombe 1998): the p for which
 * |p̂ − p| / √(p(1 − p)/n) = z. Unlike p̂ ± z·SE it stays inside [0, 1] and is not zero-width at
 * 0 % or 100 %, which matters for a backup with 12 snaps. Null when nothing was graded.
 */
export function wilsonInterval(plus: number, snaps: number, z = Z95): Interval | null {
  assertCount(plus, 'plus');
  assertCount(snaps, 'snaps');
  if (plus > snaps) throw new RangeError(`plus (${plus}) cannot exceed snaps (${snaps})`);
  if (snaps === 0) return null;
  // (2x + z² ∓ z√(z² + 4x(n − x)/n)) / (2(n + z²)): exact 0 and 1 at the ends, no cancellation.
  const z2 = z * z;
  const spread = z * Math.sqrt(z2 + (4 * plus * (snaps - plus)) / snaps);
  const denominator = 2 * (snaps + z2);
  const low = plus === 0 ? 0 : (2 * plus + z2 - spread) / denominator;
  const high = plus === snaps ? 1 : (2 * plus + z2 + spread) / denominator;
  return [Math.max(0, low), Math.min(1, high)];
}

export interface RateWithInterval {
  plus: number;
  minus: number;
  snaps: number;
  /** plus ÷ snaps, 0–1; null when nothing was graded. */
  rate: number | null;
  /** 95 % Wilson score interval; null when nothing was graded. */
  interval: Interval | null;
}

/** A player's (or a component's) plus rate with its 95 % Wilson interval. */
export function rateWithInterval(plus: number, minus: number): RateWithInterval {
  assertCount(plus, 'plus');
  assertCount(minus, 'minus');
  const snaps = plus + minus;
  return { plus, minus, snaps, rate: snaps === 0 ? null : plus / snaps, interval: wilsonInterval(plus, snaps) };
}
