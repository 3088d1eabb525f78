import type { InvitationAccept, InvitationPreview } from '@shared/api/auth';
import type { Invitation, InvitationCreate } from '@shared/api/team';
import type { Role } from '@shared/roles';
import type { AppContext } from '../core/context';
import { conflict, notFound, tokenInvalid, validationFailed } from '../core/errors';
import { hashPassword, verifyPassword } from '../core/password-hashing';
import type { SessionUser } from '../core/route';
import { createLinkToken, hashLinkToken } from '../core/tokens';
import { invitationMail } from '../mail/templates';
import { enqueueMail } from '../mail/outbox';
import { assertAcceptablePassword } from '../auth/auth.service';
import { findUserByEmail } from '../auth/users.repository';
import { findInvitationByHash, listPendingInvitations } from './staff.repository';

function invitationLink(app: AppContext, token: string): string {
  return `${app.config.publicUrl}/join?token=${encodeURIComponent(token)}`;
}

async function pendingInvitation(app: AppContext, teamId: number, invitationId: number): Promise<Invitation> {
  const found = (await listPendingInvitations(app.db, teamId, app.now())).find((i) => i.id === invitationId);
  if (!found) throw notFound('That invitation');
  return toInvitation(found);
}

function toInvitation(row: Awaited<ReturnType<typeof listPendingInvitations>>[number]): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role as Role,
    playerId: row.playerId,
    invitedBy: row.invitedBy,
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    lastSentAt: row.lastSentAt.toISOString(),
  };
}

export async function listInvitations(app: AppContext, teamId: number): Promise<Invitation[]> {
  return (await listPendingInvitations(app.db, teamId, app.now())).map(toInvitation);
}

/** Invites a person to a team with a role; the mail goes out through the queue in the same transaction. */
export async function createInvitation(app: AppContext, inviter: SessionUser, teamId: number, input: InvitationCreate): Promise<Invitation> {
  const existingMember = await app.db
    .selectFrom('memberships')
    .innerJoin('users', 'users.id', 'memberships.user_id')
    .select('memberships.id')
    .where('memberships.team_id', '=', teamId)
    .where('users.email', '=', input.email)
    .where('memberships.active', '=', true)
    .executeTakeFirst();
  if (existingMember) throw conflict('That person is already a member of this team.', { email: 'Already a member.' });
  if (input.role === 'player') await assertPlayerCanBeLinked(app, teamId, input.playerId!);

  const { token, hash } = createLinkToken();
  const expiresAt = new Date(app.now().getTime() + app.config.invitationTtlMs);
  const team = await app.db.selectFrom('teams').select('name').where('id', '=', teamId).executeTakeFirstOrThrow();
  const id = await app.db.transaction().execute(async (trx) => {
    // An earlier invitation that expired unanswered is set aside so the address can be invited again.
    await trx
      .updateTable('invitations')
      .set({ revoked_at: app.now() })
      .where('team_id', '=', teamId)
      .where('email', '=', input.email)
      .where('accepted_at', 'is', null)
      .where('revoked_at', 'is', null)
      .where('expires_at', '<=', app.now())
      .execute();
    const inserted = await trx
      .insertInto('invitations')
      .values({
        team_id: teamId,
        email: input.email,
        role: input.role,
        player_id: input.role === 'player' ? input.playerId! : null,
        token_hash: hash,
        invited_by: inviter.id,
        expires_at: expiresAt,
      })
      .onConflict((oc) => oc.doNothing())
      .returning('id')
      .executeTakeFirst();
    if (!inserted) throw conflict('That address already has a pending invitation. Resend it instead.', { email: 'Already invited.' });
    await enqueueMail(
      app,
      invitationMail({ to: input.email, teamName: team.name, inviterName: inviter.name, role: input.role, link: invitationLink(app, token), expiresAt }),
      trx,
    );
    return inserted.id;
  });
  app.logger.info({ event: 'invitation_created', teamId, invitationId: id }, 'invitation created');
  return pendingInvitation(app, teamId, id);
}

async function assertPlayerCanBeLinked(app: AppContext, teamId: number, playerId: number): Promise<void> {
  const player = await app.db.selectFrom('players').select('id').where('id', '=', playerId).where('team_id', '=', teamId).executeTakeFirst();
  if (!player) throw validationFailed('Choose a player from this roster.', { playerId: 'Not on this roster.' });
  const linked = await app.db.selectFrom('memberships').select('id').where('player_id', '=', playerId).executeTakeFirst();
  if (linked) throw conflict('That player already has an account.', { playerId: 'Already has an account.' });
}

/** Sends a pending invitation again with a fresh link (the old link stops working) and a new expiry. */
export async function resendInvitation(app: AppContext, inviter: SessionUser, teamId: number, invitationId: number): Promise<Invitation> {
  const current = await pendingInvitation(app, teamId, invitationId);
  const { token, hash } = createLinkToken();
  const expiresAt = new Date(app.now().getTime() + app.config.invitationTtlMs);
  const team = await app.db.selectFrom('teams').select('name').where('id', '=', teamId).executeTakeFirstOrThrow();
  await app.db.transaction().execute(async (trx) => {
    await trx
      .updateTable('invitations')
      .set({ token_hash: hash, expires_at: expiresAt, last_sent_at: app.now() })
      .where('id', '=', invitationId)
      .execute();
    await enqueueMail(
      app,
      invitationMail({ to: current.email, teamName: team.name, inviterName: inviter.name, role: current.role, link: invitationLink(app, token), expiresAt }),
      trx,
    );
  });
  return pendingInvitation(app, teamId, invitationId);
}

export async function revokeInvitation(app: AppContext, teamId: number, invitationId: number): Promise<void> {
  const result = await app.db
    .updateTable('invitations')
    .set({ revoked_at: app.now() })
    .where('id', '=', invitationId)
    .where('team_id', '=', teamId)
    .where('accepted_at', 'is', null)
    .where('revoked_at', 'is', null)
    .executeTakeFirst();
  if (Number(result.numUpdatedRows) === 0) throw notFound('That invitation');
}

async function usableInvitation(app: AppContext, token: string) {
  const invitation = await findInvitationByHash(app.db, hashLinkToken(token));
  if (!invitation || invitation.accepted_at || invitation.revoked_at || invitation.expires_at <= app.now()) {
    throw tokenInvalid('This invitation link is invalid, used or expired. Ask the program admin for a new one.');
  }
  return invitation;
}

export async function previewInvitation(app: AppContext, token: string): Promise<InvitationPreview> {
  const invitation = await usableInvitation(app, token);
  const account = await findUserByEmail(app.db, invitation.email);
  return {
    email: invitation.email,
    teamName: invitation.teamName,
    role: invitation.role as Role,
    ...(invitation.playerName ? { playerName: invitation.playerName } : {}),
    hasAccount: Boolean(account?.password_hash),
  };
}

/**
 * Accepts an invitation once. A new address gets an account with the given name and password; an
 * address that already has an account must give that account's password, and joins the team with it.
 */
export async function acceptInvitation(app: AppContext, input: InvitationAccept): Promise<void> {
  const invitation = await usableInvitation(app, input.token);
  const account = await findUserByEmail(app.db, invitation.email);
  if (account?.password_hash) {
    if (!account.active || !(await verifyPassword(account.password_hash, input.password))) {
      throw validationFailed('Enter the password of your existing Trenchwork account.', { password: 'Not the password of this account.' });
    }
  } else {
    if (!input.name) throw validationFailed('Enter your name.', { name: 'Enter your name.' });
    assertAcceptablePassword(input.password);
  }
  const passwordHash = account?.password_hash ? null : await hashPassword(input.password);
  await app.db.transaction().execute(async (trx) => {
    const claimed = await trx
      .updateTable('invitations')
      .set({ accepted_at: app.now() })
      .where('id', '=', invitation.id)
      .where('accepted_at', 'is', null)
      .where('revoked_at', 'is', null)
      .returning('id')
      .executeTakeFirst();
    if (!claimed) throw tokenInvalid('This invitation was already used.');
    let userId = account?.id;
    if (userId === undefined) {
      const created = await trx
        .insertInto('users')
        .values({ email: invitation.email, name: input.name!, password_hash: passwordHash, password_changed_at: app.now() })
        .returning('id')
        .executeTakeFirstOrThrow();
      userId = created.id;
    } else if (passwordHash) {
      await trx.updateTable('users').set({ name: input.name!, password_hash: passwordHash, password_changed_at: app.now() }).where('id', '=', userId).execute();
    }
    await trx
      .insertInto('memberships')
      .values({ user_id: userId, team_id: invitation.team_id, role: invitation.role, player_id: invitation.player_id })
      .onConflict((oc) => oc.columns(['user_id', 'team_id']).doUpdateSet({ role: invitation.role, player_id: invitation.player_id, active: true }))
      .execute();
  });
  app.logger.info({ event: 'invitation_accepted', teamId: invitation.team_id, invitationId: invitation.id }, 'invitation accepted');
}
