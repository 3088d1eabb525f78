import type { Pool } from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';

/** A counter of attempts per key in PostgreSQL (table rate_limits, made by a migration). */
export function pgLimiter(pool: Pool, keyPrefix: string, points: number, durationSeconds: number): RateLimiterPostgres {
  return new RateLimiterPostgres({ storeClient: pool, storeType: 'pool', tableName: 'rate_limits', tableCreated: true, keyPrefix, points, duration: durationSeconds });
}

/** Takes one point: 0 when taken, otherwise the milliseconds until one frees up. */
export async function takePoint(limiter: RateLimiterPostgres, key: string): Promise<number> {
  try {
    await limiter.consume(key);
    return 0;
  } catch (error) {
    // A rejection with RateLimiterRes means no point is left; anything else is a real failure.
    if (error instanceof RateLimiterRes) return Math.max(error.msBeforeNext, 1000);
    throw error;
  }
}
