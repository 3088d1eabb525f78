import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import type { Config } from './config';
import { AppError } from './errors';
import type { Logger } from './logger';

/**
 * Signed double-submit CSRF protection in the form Angular's HttpClient supports out of the box:
 * the server sets a JS-readable XSRF-TOKEN cookie, the client echoes it in X-XSRF-TOKEN.
 * The token is an HMAC bound to the session (or, before sign-in, to a random pre-session cookie),
 * so a token planted from another session does not verify. Cross-site requests are refused by
 * Sec-Fetch-Site and Origin as well.
 */
export const XSRF_COOKIE = 'XSRF-TOKEN';
export const XSRF_HEADER = 'x-xsrf-token';
const PRESESSION_COOKIE = 'tw.pre';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

declare module 'express-session' {
  interface SessionData {
    csrfBinding?: string;
    loginAt?: number;
  }
}

function sign(secret: string, binding: string, nonce: string): string {
  return createHmac('sha256', secret).update(`${binding}.${nonce}`).digest('base64url');
}

export function makeToken(secret: string, binding: string): string {
  const nonce = randomBytes(18).toString('base64url');
  return `${nonce}.${sign(secret, binding, nonce)}`;
}

export function verifyToken(secret: string, binding: string, token: string): boolean {
  const [nonce, mac, extra] = token.split('.');
  if (!nonce || !mac || extra !== undefined) return false;
  const expected = Buffer.from(sign(secret, binding, nonce));
  const given = Buffer.from(mac);
  return expected.length === given.length && timingSafeEqual(expected, given);
}

function binding(req: Request): string | undefined {
  return req.session?.csrfBinding ?? (req.cookies?.[PRESESSION_COOKIE] as string | undefined);
}

export function createCsrf(config: Config, logger: Logger) {
  const cookieOptions = { sameSite: 'lax' as const, secure: config.secureCookies, path: '/' };

  function issue(res: Response, bind: string): void {
    res.cookie(XSRF_COOKIE, makeToken(config.sessionSecret, bind), { ...cookieOptions, httpOnly: false });
  }

  function allowedOrigin(req: Request, origin: string): boolean {
    if (origin === new URL(config.publicUrl).origin) return true;
    const host = req.get('host');
    return host !== undefined && (origin === `http://${host}` || origin === `https://${host}`);
  }

  function reject(req: Request, reason: string): AppError {
    logger.warn({ event: 'csrf_rejected', reason, method: req.method, path: req.path }, 'CSRF check failed');
    return new AppError(403, 'csrf_rejected', 'This request could not be verified. Reload the page and try again.');
  }

  const middleware = (req: Request, res: Response, next: NextFunction): void => {
    let bind = binding(req);
    if (SAFE_METHODS.has(req.method)) {
      if (!bind) {
        bind = randomBytes(24).toString('base64url');
        res.cookie(PRESESSION_COOKIE, bind, { ...cookieOptions, httpOnly: true });
      }
      const existing = req.cookies?.[XSRF_COOKIE] as string | undefined;
      if (!existing || !verifyToken(config.sessionSecret, bind, existing)) issue(res, bind);
      next();
      return;
    }
    const site = req.get('sec-fetch-site');
    if (site && site !== 'same-origin' && site !== 'none') return next(reject(req, `sec-fetch-site ${site}`));
    const origin = req.get('origin');
    if (origin && !allowedOrigin(req, origin)) return next(reject(req, 'origin'));
    const header = req.get(XSRF_HEADER);
    const cookie = req.cookies?.[XSRF_COOKIE] as string | undefined;
    if (!bind || !header || header !== cookie || !verifyToken(config.sessionSecret, bind, header)) {
      return next(reject(req, header ? 'token mismatch' : 'token missing'));
    }
    next();
  };

  /** After sign-in or sign-out the binding changes: hand the client a token for the new one. */
  function rotate(req: Request, res: Response): void {
    const bind = binding(req);
    if (bind) issue(res, bind);
  }

  return { middleware, rotate };
}
