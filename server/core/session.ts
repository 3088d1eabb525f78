import connectPgSimple from 'connect-pg-simple';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import session from 'express-session';
import type pg from 'pg';
import type { Config } from './config';
import type { Logger } from './logger';
import { TouchThrottle } from './session-touch-throttle';

/** The session cookie's name: `__Host-` prefixed when served over https (no Domain, Path=/, Secure). */
export function sessionCookieName(config: Config): string {
  return config.secureCookies ? '__Host-tw.sid' : 'tw.sid';
}

/**
 * Sessions live in PostgreSQL (connect-pg-simple) so that several API processes share them.
 * Idle timeout: rolling cookie maxAge (default 3 h: a coach grading a game pauses for film, not
 * for hours). Absolute timeout: `loginAt` in the session, checked by `enforceAbsoluteTimeout`
 * (default 14 h: one long Sunday).
 *
 * Rolling means every answer moves the expiry. The cookie's moves for free; the stored one is an
 * UPDATE and a commit, which on a busy Grading Desk cost more than the save it rode along with.
 * So the store skips a touch when this process wrote that session's expiry less than a minute ago
 * (TouchThrottle): the stored expiry then lags the cookie by at most a minute, and an idle session
 * ends on the server up to a minute before the configured idle time. `now` is the app's clock.
 */
export function createSessionMiddleware(config: Config, pool: pg.Pool, now: () => Date, logger?: Logger): RequestHandler {
  const PgStore = connectPgSimple(session);
  const throttle = new TouchThrottle(now);
  class ThrottledPgStore extends PgStore {
    override touch(sid: string, sess: session.SessionData, callback?: (err?: unknown) => void): void {
      if (throttle.isFresh(sid)) {
        callback?.();
        return;
      }
      // Noted before the write, so parallel requests of one session touch it once; a failed write is forgotten.
      throttle.written(sid);
      super.touch(sid, sess, (err?: unknown) => {
        if (err) throttle.forget(sid);
        callback?.(err);
      });
    }

    override set(sid: string, sess: session.SessionData, callback?: (err?: unknown) => void): void {
      throttle.written(sid);
      super.set(sid, sess, (err?: unknown) => {
        if (err) throttle.forget(sid);
        callback?.(err);
      });
    }

    override destroy(sid: string, callback?: (err?: unknown) => void): void {
      throttle.forget(sid);
      super.destroy(sid, callback);
    }
  }
  const store = new ThrottledPgStore({
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
