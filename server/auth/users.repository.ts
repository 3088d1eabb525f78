import { sql } from 'kysely';
import type { Database } from '../../db/database';

export function findUserByEmail(db: Database, email: string) {
  return db.selectFrom('users').selectAll().where('email', '=', email).executeTakeFirst();
}

export function findActiveUserById(db: Database, id: number) {
  return db
    .selectFrom('users')
    .select(['id', 'email', 'name'])
    .where('id', '=', id)
    .where('active', '=', true)
    .executeTakeFirst();
}

export function listMemberships(db: Database, userId: number) {
  return db
    .selectFrom('memberships')
    .innerJoin('teams', 'teams.id', 'memberships.team_id')
    .select(['memberships.team_id as teamId', 'teams.name as teamName', 'memberships.role', 'memberships.player_id as playerId'])
    .where('memberships.user_id', '=', userId)
    .where('memberships.active', '=', true)
    .orderBy('teams.name')
    .execute();
}

export async function setPassword(db: Database, userId: number, passwordHash: string, at: Date): Promise<void> {
  await db.updateTable('users').set({ password_hash: passwordHash, password_changed_at: at }).where('id', '=', userId).execute();
}

/** Ends every stored session of a user except `keepSid` (password change, reset, deactivation). */
export async function deleteSessionsOfUser(db: Database, userId: number, keepSid?: string): Promise<number> {
  let query = db.deleteFrom('session').where(sql<string>`sess->'passport'->>'user'`, '=', String(userId));
  if (keepSid) query = query.where('sid', '<>', keepSid);
  const result = await query.executeTakeFirst();
  return Number(result.numDeletedRows);
}
