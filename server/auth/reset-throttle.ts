import type pg from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';

/**
 * Limits password-reset requests so the form cannot be used to flood someone's inbox: at most 3 mails
 * per address per hour (further requests are answered the same but send nothing) and 20 requests per
 * client address per hour (then 429). Counted in PostgreSQL, shared by every API process.
 */
export interface ResetThrottle {
  /** 'send', 'quiet' (answer as usual, send nothing) or milliseconds to wait for this client address. */
  check(email: string, ip: string): Promise<'send' | 'quiet' | number>;
}

export function createResetThrottle(pool: pg.Pool): ResetThrottle {
  const common = { storeClient: pool, storeType: 'pool', tableName: 'rate_limits', tableCreated: true, duration: 3600 };
  const perAddress = new RateLimiterPostgres({ ...common, keyPrefix: 'reset_email', points: 3 });
  const perIp = new RateLimiterPostgres({ ...common, keyPrefix: 'reset_ip', points: 20 });
  const take = async (limiter: RateLimiterPostgres, key: string): Promise<number> => {
    try {
      await limiter.consume(key);
      return 0;
    } catch (error) {
      if (error instanceof RateLimiterRes) return Math.max(error.msBeforeNext, 1000);
      throw error;
    }
  };
  return {
    async check(email, ip) {
      const wait = await take(perIp, ip);
      if (wait > 0) return wait;
      return (await take(perAddress, email)) > 0 ? 'quiet' : 'send';
    },
  };
}
