import connectPgSimple from 'connect-pg-simple';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import session from 'express-session';
import type pg from 'pg';
import type { Config } from './config';
import type { Logger } from './logger';

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
export function createSessionMiddleware(config: Config, pool: pg.Pool, logger?: Logger): RequestHandler {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    pruneSessionInterval: config.env === 'test' ? false : 15 * 60,
  });
  const middleware = session({
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
  // express-session calls next a second time when touching or saving the session fails after the
  // answer went out (the database going away mid-request). Passed on, that error found no handler
  // left and Express's final handler destroyed the socket under the client's next keep-alive
  // request. The client has its answer: log the failure and keep the connection.
  return (req, res, next) => {
    let passedOn = false;
    middleware(req, res, (error?: unknown) => {
      if (passedOn) {
        if (error) logger?.warn({ event: 'session_store_failed', err: error }, 'session store failed after the answer was sent');
        return;
      }
      passedOn = true;
      next(error);
    });
  };
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
