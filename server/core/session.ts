import connectPgSimple from 'connect-pg-simple';
import type { NextFunction, Request, Response } from 'express';
import session from 'express-session';
import type pg from 'pg';
import type { Config } from './config';

/** The session cookie's name: `__Host-` prefixed when served over https (no Domain, Path=/, Secure). */
export function sessionCookieName(config: Config): string {
  return config.secureCookies ? '__Host-tw.sid' : 'tw.sid';
}

/**
 * Sessions live in PostgreSQL (connect-pg-simple) so that several API processes share them.
 * Idle timeout: rolling cookie maxAge (default 3 h: a coach grading a game pauses for film, not
 * for hours). Absolute timeout: `loginAt` in the session, checked by `enforceAbsoluteTimeout`
 * (default 14 h: one long Sunday).
 */
export function createSessionMiddleware(config: Config, pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    pruneSessionInterval: config.env === 'test' ? false : 15 * 60,
  });
  return session({
    name: sessionCookieName(config),
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.trustProxy,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.secureCookies,
      maxAge: config.sessionIdleMs,
      path: '/',
    },
  });
}

export function enforceAbsoluteTimeout(config: Config, now: () => Date) {
  return (req: Request, _res: Response, next: NextFunction): void => {
    const loginAt = req.session?.loginAt;
    if (req.user && loginAt && now().getTime() - loginAt > config.sessionAbsoluteMs) {
      req.session.destroy((err) => {
        if (err) return next(err);
        // The request goes on as anonymous; routes that need a user answer 401.
        (req as { user?: unknown }).user = undefined;
        next();
      });
      return;
    }
    next();
  };
}
