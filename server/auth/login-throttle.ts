import type pg from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import type { Config } from '../core/config';

/**
 * Counts failed sign-ins per account and per IP address in PostgreSQL (shared by every API process).
 * ASVS 5.0 §6.3 asks for at most 100 failures per account per hour; we allow far fewer
 * (default 10 per account and 50 per address in 15 minutes).
 */
export interface LoginThrottle {
  /**
   * Reserves one attempt for this account and this address before the password is checked, so a
   * burst of parallel guesses cannot get more checks than the limit. Answers the milliseconds until
   * the caller may try again when no attempt is left, else 0.
   */
  reserveAttempt(email: string, ip: string): Promise<number>;
  /** A right password: the account's count starts over and the address gets its attempt back. */
  recordSuccess(email: string, ip: string): Promise<void>;
}

export function createLoginThrottle(config: Config, pool: pg.Pool): LoginThrottle {
  const common = { storeClient: pool, storeType: 'pool', tableName: 'rate_limits', tableCreated: true, duration: config.loginThrottle.windowSeconds };
  const perAccount = new RateLimiterPostgres({ ...common, keyPrefix: 'login_account', points: config.loginThrottle.perAccount });
  const perIp = new RateLimiterPostgres({ ...common, keyPrefix: 'login_ip', points: config.loginThrottle.perIp });

  /** 0 when a point was taken; otherwise how long until one frees up. */
  async function take(limiter: RateLimiterPostgres, key: string): Promise<number> {
    try {
      await limiter.consume(key);
      return 0;
    } catch (error) {
      // A rejection with RateLimiterRes means no point is left; anything else is a real failure.
      if (error instanceof RateLimiterRes) return Math.max(error.msBeforeNext, 1000);
      throw error;
    }
  }

  return {
    async reserveAttempt(email, ip) {
      const address = await take(perIp, ip);
      if (address > 0) return address;
      const account = await take(perAccount, email);
      if (account > 0) await perIp.reward(ip, 1);
      return account;
    },
    async recordSuccess(email, ip) {
      await Promise.all([perAccount.delete(email), perIp.reward(ip, 1)]);
    },
  };
}
