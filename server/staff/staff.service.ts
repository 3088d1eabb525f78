import type { Member, StaffResponse } from '@shared/api/team';
import type { Role } from '@shared/roles';
import type { AppContext } from '../core/context';
import { conflict, forbidden, notFound } from '../core/errors';
import { deleteSessionsOfUser } from '../auth/users.repository';
import { listInvitations } from './invitations.service';
import { listMembers } from './staff.repository';

function toMember(row: Awaited<ReturnType<typeof listMembers>>[number]): Member {
  return { ...row, role: row.role as Role, joinedAt: row.joinedAt.toISOString() };
}

export async function describeStaff(app: AppContext, teamId: number): Promise<StaffResponse> {
  const [members, invitations] = await Promise.all([listMembers(app.db, teamId), listInvitations(app, teamId)]);
  return { members: members.map(toMember), invitations };
}

/**
 * Changes a member's role or deactivates them. A team always keeps at least one active admin.
 * Deactivation keeps the membership row (history stays), and ends the account's sessions when it has
 * no other active team.
 */
export async function updateMember(
  app: AppContext,
  teamId: number,
  actorMembershipId: number,
  membershipId: number,
  change: { role?: Role; active?: boolean },
): Promise<Member> {
  const updated = await app.db.transaction().execute(async (trx) => {
    // Lock the target and every admin row of the team in one statement, in id order, so two
    // concurrent changes (two admins demoting each other) queue up instead of deadlocking.
    const locked = await trx
      .selectFrom('memberships')
      .select(['id', 'user_id', 'role', 'active'])
      .where('team_id', '=', teamId)
      .where((eb) => eb.or([eb('id', '=', membershipId), eb('id', '=', actorMembershipId), eb('role', '=', 'admin')]))
      .orderBy('id')
      .forUpdate()
      .execute();
    const current = locked.find((m) => m.id === membershipId);
    if (!current) throw notFound('That member');
    // Authorization ran before this transaction: make sure the actor is still an admin now, under the lock.
    const actor = locked.find((m) => m.id === actorMembershipId);
    if (!actor || actor.role !== 'admin' || !actor.active) throw forbidden();
    if (change.role === 'player' && current.role !== 'player') {
      throw conflict('A player account belongs to a roster entry: invite the player from the staff page instead.', { role: 'Not for staff accounts.' });
    }
    if (change.role && change.role !== 'player' && current.role === 'player') {
      throw conflict('A player account stays a player account; invite the person again with a staff role.', { role: 'Not for player accounts.' });
    }
    const losesAdmin = current.role === 'admin' && current.active && ((change.role && change.role !== 'admin') || change.active === false);
    const activeAdmins = locked.filter((m) => m.role === 'admin' && m.active).length;
    if (losesAdmin && activeAdmins <= 1) throw conflict('A team needs at least one active admin. Make someone else admin first.');
    await trx
      .updateTable('memberships')
      .set({ ...(change.role ? { role: change.role } : {}), ...(change.active !== undefined ? { active: change.active } : {}) })
      .where('id', '=', membershipId)
      .execute();
    if (change.active === false) {
      const others = await trx
        .selectFrom('memberships')
        .select('id')
        .where('user_id', '=', current.user_id)
        .where('active', '=', true)
        .executeTakeFirst();
      if (!others) await deleteSessionsOfUser(trx, current.user_id);
    }
    return current.user_id;
  });
  const member = (await listMembers(app.db, teamId)).find((m) => m.membershipId === membershipId && m.userId === updated);
  if (!member) throw notFound('That member');
  return toMember(member);
}
