import type pg from 'pg';
import { pgLimiter, takePoint } from './rate-points';

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
  const perAddress = pgLimiter(pool, 'reset_email', 3, 3600);
  const perIp = pgLimiter(pool, 'reset_ip', 20, 3600);
  return {
    async check(email, ip) {
      const wait = await takePoint(perIp, ip);
      if (wait > 0) return wait;
      return (await takePoint(perAddress, email)) > 0 ? 'quiet' : 'send';
    },
  };
}
