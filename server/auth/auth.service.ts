import type { MeResponse } from '@shared/api/auth';
import { passwordProblem } from '@shared/passwords';
import type { Role } from '@shared/roles';
import type { AppContext } from '../core/context';
import { tokenInvalid, validationFailed } from '../core/errors';
import { hashPassword, verifyAgainstDummy, verifyPassword } from '../core/password-hashing';
import type { SessionUser } from '../core/route';
import { createLinkToken, hashLinkToken } from '../core/tokens';
import { passwordResetMail } from '../mail/templates';
import { enqueueMail } from '../mail/outbox';
import { deleteSessionsOfUser, findActiveUserById, findUserByEmail, listMemberships, setPassword } from './users.repository';

/** Checks an e-mail and password. Unknown and known accounts take about the same time. */
export async function verifyCredentials(app: AppContext, email: string, password: string): Promise<SessionUser | null> {
  const user = await findUserByEmail(app.db, email);
  if (!user || !user.active || !user.password_hash) return verifyAgainstDummy(password).then(() => null);
  return (await verifyPassword(user.password_hash, password)) ? { id: user.id, email: user.email, name: user.name } : null;
}

export async function loadSessionUser(app: AppContext, id: number): Promise<SessionUser | null> {
  return (await findActiveUserById(app.db, id)) ?? null;
}

export async function describeMe(app: AppContext, user: SessionUser): Promise<MeResponse> {
  const memberships = await listMemberships(app.db, user.id);
  return {
    user: { id: user.id, email: user.email, name: user.name },
    memberships: memberships.map((m) => ({
      teamId: m.teamId,
      teamName: m.teamName,
      role: m.role as Role,
      ...(m.role === 'player' && m.playerId !== null ? { playerId: m.playerId } : {}),
    })),
  };
}

/** Throws a 422 naming the password field when the new password breaks the policy. */
export function assertAcceptablePassword(password: string): void {
  const problem = passwordProblem(password);
  if (problem) throw validationFailed('Choose a different password.', { password: problem });
}

/**
 * Starts a reset when the address belongs to an active account. Answers nothing either way, so the
 * response does not tell whether an account exists. The mail is enqueued in the same transaction.
 */
export async function requestPasswordReset(app: AppContext, email: string): Promise<void> {
  const user = await findUserByEmail(app.db, email);
  if (!user || !user.active) {
    app.logger.info({ event: 'password_reset_unknown' }, 'password reset asked for an unknown address');
    return;
  }
  const { token, hash } = createLinkToken();
  const ttlMinutes = Math.round(app.config.passwordResetTtlMs / 60_000);
  await app.db.transaction().execute(async (trx) => {
    await trx
      .insertInto('password_resets')
      .values({ user_id: user.id, token_hash: hash, expires_at: new Date(app.now().getTime() + app.config.passwordResetTtlMs) })
      .execute();
    const link = `${app.config.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
    await enqueueMail(app, passwordResetMail({ to: user.email, name: user.name, link, ttlMinutes }), trx);
  });
}

/** Sets a new password from a reset link; the link works once and every session of the account ends. */
export async function confirmPasswordReset(app: AppContext, token: string, password: string): Promise<void> {
  assertAcceptablePassword(password);
  const passwordHash = await hashPassword(password);
  const userId = await app.db.transaction().execute(async (trx) => {
    const used = await trx
      .updateTable('password_resets')
      .set({ used_at: app.now() })
      .where('token_hash', '=', hashLinkToken(token))
      .where('used_at', 'is', null)
      .where('expires_at', '>', app.now())
      .returning('user_id')
      .executeTakeFirst();
    if (!used) return null;
    await setPassword(trx, used.user_id, passwordHash, app.now());
    // Any other outstanding reset links of this account stop working too.
    await trx.updateTable('password_resets').set({ used_at: app.now() }).where('user_id', '=', used.user_id).where('used_at', 'is', null).execute();
    await deleteSessionsOfUser(trx, used.user_id);
    return used.user_id;
  });
  if (userId === null) throw tokenInvalid('This reset link is invalid, used or expired. Ask for a new one.');
  app.logger.info({ event: 'password_reset_done', userId }, 'password reset');
}
