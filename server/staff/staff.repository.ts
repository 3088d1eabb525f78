import type { Database } from '../../db/database';

export function listMembers(db: Database, teamId: number) {
  return db
    .selectFrom('memberships')
    .innerJoin('users', 'users.id', 'memberships.user_id')
    .select([
      'memberships.id as membershipId',
      'users.id as userId',
      'users.name',
      'users.email',
      'memberships.role',
      'memberships.player_id as playerId',
      'memberships.active',
      'memberships.created_at as joinedAt',
    ])
    .where('memberships.team_id', '=', teamId)
    .orderBy('memberships.active', 'desc')
    .orderBy('users.name')
    .execute();
}

export function listPendingInvitations(db: Database, teamId: number, now: Date) {
  return db
    .selectFrom('invitations')
    .innerJoin('users', 'users.id', 'invitations.invited_by')
    .select([
      'invitations.id',
      'invitations.email',
      'invitations.role',
      'invitations.player_id as playerId',
      'users.name as invitedBy',
      'invitations.created_at as createdAt',
      'invitations.expires_at as expiresAt',
      'invitations.last_sent_at as lastSentAt',
    ])
    .where('invitations.team_id', '=', teamId)
    .where('invitations.accepted_at', 'is', null)
    .where('invitations.revoked_at', 'is', null)
    .where('invitations.expires_at', '>', now)
    .orderBy('invitations.created_at', 'desc')
    .execute();
}

export function findInvitationByHash(db: Database, tokenHash: string) {
  return db
    .selectFrom('invitations')
    .innerJoin('teams', 'teams.id', 'invitations.team_id')
    .leftJoin('players', 'players.id', 'invitations.player_id')
    .select([
      'invitations.id',
      'invitations.team_id',
      'invitations.email',
      'invitations.role',
      'invitations.player_id',
      'invitations.expires_at',
      'invitations.accepted_at',
      'invitations.revoked_at',
      'teams.name as teamName',
      'players.name as playerName',
    ])
    .where('invitations.token_hash', '=', tokenHash)
    .executeTakeFirst();
}
