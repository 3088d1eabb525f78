import type pg from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import type { Config } from '../core/config';

/**
 * Counts failed sign-ins per account and per IP address in PostgreSQL (shared by every API process).
 * ASVS 5.0 §6.3 asks for at most 100 failures per account per hour; we allow far fewer
 * (default 10 per account and 50 per address in 15 minutes).
 */
export interface LoginThrottle {
  /** Milliseconds until the caller may try again, or 0 when it may try now. */
  retryAfterMs(email: string, ip: string): Promise<number>;
  recordFailure(email: string, ip: string): Promise<void>;
  recordSuccess(email: string): Promise<void>;
}

export function createLoginThrottle(config: Config, pool: pg.Pool): LoginThrottle {
  const common = { storeClient: pool, storeType: 'pool', tableName: 'rate_limits', tableCreated: true, duration: config.loginThrottle.windowSeconds };
  const perAccount = new RateLimiterPostgres({ ...common, keyPrefix: 'login_account', points: config.loginThrottle.perAccount });
  const perIp = new RateLimiterPostgres({ ...common, keyPrefix: 'login_ip', points: config.loginThrottle.perIp });

  async function blockedFor(limiter: RateLimiterPostgres, key: string, points: number): Promise<number> {
    const res = await limiter.get(key);
    return res && res.consumedPoints >= points ? Math.max(res.msBeforeNext, 1000) : 0;
  }

  async function consume(limiter: RateLimiterPostgres, key: string): Promise<void> {
    try {
      await limiter.consume(key);
    } catch (error) {
      // A rejection with RateLimiterRes only means the limit is now reached; anything else is real.
      if (!(error instanceof RateLimiterRes)) throw error;
    }
  }

  return {
    async retryAfterMs(email, ip) {
      const [account, address] = await Promise.all([
        blockedFor(perAccount, email, config.loginThrottle.perAccount),
        blockedFor(perIp, ip, config.loginThrottle.perIp),
      ]);
      return Math.max(account, address);
    },
    async recordFailure(email, ip) {
      await Promise.all([consume(perAccount, email), consume(perIp, ip)]);
    },
    async recordSuccess(email) {
      await perAccount.delete(email);
    },
  };
}
