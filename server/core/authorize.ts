import type { Request } from 'express';
import { ROLES, type Role } from '@shared/roles';
import type { AppContext } from './context';
import { forbidden, notFound, unauthenticated } from './errors';
import type { Access, SessionUser, TeamMembership } from './route';

/** Loads the caller's active membership in a team, or null. */
export async function findMembership(app: AppContext, userId: number, teamId: number): Promise<TeamMembership | null> {
  const row = await app.db
    .selectFrom('memberships')
    .select(['id', 'team_id', 'role', 'player_id'])
    .where('user_id', '=', userId)
    .where('team_id', '=', teamId)
    .where('active', '=', true)
    .executeTakeFirst();
  if (!row || !(ROLES as readonly string[]).includes(row.role)) return null;
  return { id: row.id, teamId: row.team_id, role: row.role as Role, playerId: row.player_id };
}

/**
 * Applies a route's access rule. Returns the membership for team routes.
 * Every refusal is logged with a stable event name.
 */
export async function authorize(
  app: AppContext,
  req: Request,
  access: Access,
  params: unknown,
  operationId: string,
): Promise<TeamMembership | null> {
  if (access.kind === 'public') return null;
  const user = req.user as SessionUser | undefined;
  if (!user) throw unauthenticated();
  if (access.kind === 'signedIn') return null;
  const teamId = await access.team(app, params, req);
  if (teamId === null) throw notFound();
  const membership = await findMembership(app, user.id, teamId);
  if (!membership || !access.roles.includes(membership.role)) {
    app.logger.warn({ event: 'authz_denied', userId: user.id, teamId, operationId, role: membership?.role ?? null }, 'authorization denied');
    throw forbidden();
  }
  return membership;
}
