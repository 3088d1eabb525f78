import type pg from 'pg';
import { pgLimiter, takePoint } from './rate-points';
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
  const window = config.loginThrottle.windowSeconds;
  const perAccount = pgLimiter(pool, 'login_account', config.loginThrottle.perAccount, window);
  const perIp = pgLimiter(pool, 'login_ip', config.loginThrottle.perIp, window);
  return {
    async reserveAttempt(email, ip) {
      const address = await takePoint(perIp, ip);
      if (address > 0) return address;
      const account = await takePoint(perAccount, email);
      if (account > 0) await perIp.reward(ip, 1);
      return account;
    },
    async recordSuccess(email, ip) {
      await Promise.all([perAccount.delete(email), perIp.reward(ip, 1)]);
    },
  };
}
