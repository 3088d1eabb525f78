import { randomBytes } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { z } from 'zod';
import {
  invitationAcceptSchema,
  invitationPreviewSchema,
  loginRequestSchema,
  meResponseSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
} from '@shared/api/auth';
import { AppError } from '../core/errors';
import { defineRoute, Reply, type RouteDefinition, type SessionUser } from '../core/route';
import type { createCsrf } from '../core/csrf';
import { confirmPasswordReset, describeMe, requestPasswordReset } from './auth.service';
import type { LoginThrottle } from './login-throttle';
import type { ResetThrottle } from './reset-throttle';
import type { createPassport } from './passport';
import { acceptInvitation, previewInvitation } from '../staff/invitations.service';

interface AuthDeps {
  passport: ReturnType<typeof createPassport>;
  throttle: LoginThrottle;
  resetThrottle: ResetThrottle;
  csrf: ReturnType<typeof createCsrf>;
}

function authenticate(passport: AuthDeps['passport'], req: Request, res: Response): Promise<SessionUser | false> {
  return new Promise((resolve, reject) => {
    const next: NextFunction = (err?: unknown) => (err ? reject(err) : resolve(false));
    passport.authenticate('local', { session: false }, (err: unknown, user: SessionUser | false) => {
      if (err) reject(err);
      else resolve(user);
    })(req, res, next);
  });
}

function logIn(req: Request, user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));
}

function logOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.logOut((err) => (err ? reject(err) : resolve())));
}

const tokenParams = z.object({ token: z.string().min(16).max(200) });

export function authRoutes(deps: AuthDeps): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'login',
      method: 'post',
      path: '/auth/login',
      summary: 'Sign in with e-mail and password; starts a new session (the session id changes).',
      tags: ['auth'],
      access: { kind: 'public' },
      body: loginRequestSchema,
      responses: {
        200: { description: 'Signed in', schema: meResponseSchema },
        401: { description: 'E-mail and password do not match an active account' },
        429: { description: 'Too many failed sign-ins for this account or address' },
      },
      handler: async ({ app, req, res, body }) => {
        const ip = req.ip ?? 'unknown';
        const waitMs = await deps.throttle.reserveAttempt(body.email, ip);
        if (waitMs > 0) {
          const minutes = Math.ceil(waitMs / 60_000);
          res.set('Retry-After', String(Math.ceil(waitMs / 1000)));
          app.logger.warn({ event: 'login_locked', ip }, 'sign-in throttled');
          throw new AppError(429, 'too_many_requests', `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`);
        }
        // passport-local reads the normalised address.
        req.body = body;
        const user = await authenticate(deps.passport, req, res);
        if (!user) {
          app.logger.warn({ event: 'login_failed', ip }, 'sign-in failed');
          throw new AppError(401, 'invalid_credentials', 'That e-mail and password do not match an account.');
        }
        await deps.throttle.recordSuccess(body.email, ip);
        await logIn(req, user);
        req.session.loginAt = app.now().getTime();
        req.session.csrfBinding = randomBytes(24).toString('base64url');
        deps.csrf.rotate(req, res);
        app.logger.info({ event: 'login', userId: user.id }, 'signed in');
        return describeMe(app, user);
      },
    }),
    defineRoute({
      operationId: 'logout',
      method: 'post',
      path: '/auth/logout',
      summary: 'Sign out: the session is destroyed.',
      tags: ['auth'],
      access: { kind: 'public' },
      responses: { 204: { description: 'Signed out (also when no one was signed in)' } },
      handler: async ({ req, res }) => {
        if (req.user) await logOut(req);
        if (req.session) await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
        res.clearCookie(req.app.get('sessionCookieName') as string, { path: '/' });
        (req as { session?: unknown }).session = undefined;
        deps.csrf.rotate(req, res);
        return undefined;
      },
    }),
    defineRoute({
      operationId: 'me',
      method: 'get',
      path: '/auth/me',
      summary: 'The signed-in account and its team memberships.',
      tags: ['auth'],
      access: { kind: 'signedIn' },
      responses: { 200: { description: 'The account', schema: meResponseSchema }, 401: { description: 'Not signed in' } },
      handler: async ({ app, user }) => describeMe(app, user!),
    }),
    defineRoute({
      operationId: 'requestPasswordReset',
      method: 'post',
      path: '/auth/password-reset/request',
      summary: 'Mail a password reset link when the address has an account; the answer is the same either way.',
      tags: ['auth'],
      access: { kind: 'public' },
      body: passwordResetRequestSchema,
      responses: { 202: { description: 'Accepted' }, 429: { description: 'Too many requests from this address' } },
      handler: async ({ app, req, res, body }) => {
        const verdict = await deps.resetThrottle.check(body.email, req.ip ?? 'unknown');
        if (typeof verdict === 'number') {
          res.set('Retry-After', String(Math.ceil(verdict / 1000)));
          app.logger.warn({ event: 'rate_limited', route: 'password_reset' }, 'reset requests throttled');
          throw new AppError(429, 'too_many_requests', 'Too many reset requests from here. Try again later.');
        }
        if (verdict === 'send') await requestPasswordReset(app, body.email);
        else app.logger.warn({ event: 'rate_limited', route: 'password_reset_address' }, 'reset mail for one address throttled');
        return new Reply(202, {});
      },
    }),
    defineRoute({
      operationId: 'confirmPasswordReset',
      method: 'post',
      path: '/auth/password-reset/confirm',
      summary: 'Set a new password with a reset link token. Every session of the account ends; sign in again.',
      tags: ['auth'],
      access: { kind: 'public' },
      body: passwordResetConfirmSchema,
      responses: { 204: { description: 'Password changed' }, 400: { description: 'Invalid, used or expired token' }, 422: { description: 'Password not acceptable' } },
      handler: async ({ app, body }) => {
        await confirmPasswordReset(app, body.token, body.password);
        return new Reply(204);
      },
    }),
    defineRoute({
      operationId: 'previewInvitation',
      method: 'get',
      path: '/invitations/{token}',
      summary: 'What an invitation link is for (team, role), before accepting it.',
      tags: ['auth'],
      access: { kind: 'public' },
      params: tokenParams,
      responses: { 200: { description: 'The invitation', schema: invitationPreviewSchema }, 400: { description: 'Invalid or expired token' } },
      handler: async ({ app, params }) => previewInvitation(app, params.token),
    }),
    defineRoute({
      operationId: 'acceptInvitation',
      method: 'post',
      path: '/invitations/accept',
      summary: 'Accept an invitation: set name and password (or join with an existing account). Then sign in.',
      tags: ['auth'],
      access: { kind: 'public' },
      body: invitationAcceptSchema,
      responses: { 204: { description: 'Joined' }, 400: { description: 'Invalid, used or expired token' }, 422: { description: 'Invalid name or password' } },
      handler: async ({ app, body }) => {
        await acceptInvitation(app, body);
        return new Reply(204);
      },
    }),
  ];
}
