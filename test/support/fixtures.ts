import { randomBytes } from 'node:crypto';
import type { Role } from '@shared/roles';
import type { Database } from '../../db/database';
import { hashPassword } from '../../server/core/password-hashing';

export const TEST_PASSWORD = 'correct-horse-battery';
let cachedHash: Promise<string> | undefined;

export interface TeamFixture {
  teamId: number;
  seasonId: number;
  /** One account per role: e-mail addresses unique to this fixture. */
  accounts: Record<Role, { userId: number; email: string }>;
  playerIds: number[];
  /** The roster entry linked to the player account. */
  ownPlayerId: number;
}

/** A team with a current season, three linemen, and one account for each of the five roles. */
export async function createTeamFixture(db: Database, label = 'Test'): Promise<TeamFixture> {
  cachedHash ??= hashPassword(TEST_PASSWORD);
  const passwordHash = await cachedHash;
  const tag = randomBytes(3).toString('hex');
  const team = await db.insertInto('teams').values({ name: `${label} Team ${tag}` }).returning('id').executeTakeFirstOrThrow();
  const season = await db
    .insertInto('seasons')
    .values({ team_id: team.id, name: '2026', starts_on: '2026-08-01', ends_on: '2026-12-15', is_current: true })
    .returning('id')
    .executeTakeFirstOrThrow();
  const playerIds: number[] = [];
  for (const [i, [name, position]] of ([['Avery Lintel', 'LT'], ['Brook Sandor', 'LG'], ['Casey Morrow', 'C']] as const).entries()) {
    const player = await db.insertInto('players').values({ team_id: team.id, name }).returning('id').executeTakeFirstOrThrow();
    await db
      .insertInto('roster_entries')
      .values({ season_id: season.id, player_id: player.id, jersey: 70 + i, positions: [position], class_year: 'Jr', height_in: 75, weight_lb: 280 })
      .execute();
    playerIds.push(player.id);
  }
  const accounts = {} as TeamFixture['accounts'];
  for (const role of ['admin', 'coordinator', 'coach', 'analyst', 'player'] as const) {
    const email = `${role}.${tag}@${label.toLowerCase()}.test`;
    const user = await db.insertInto('users').values({ email, name: `${label} ${role}`, password_hash: passwordHash }).returning('id').executeTakeFirstOrThrow();
    await db
      .insertInto('memberships')
      .values({ user_id: user.id, team_id: team.id, role, player_id: role === 'player' ? playerIds[1]! : null })
      .execute();
    accounts[role] = { userId: user.id, email };
  }
  return { teamId: team.id, seasonId: season.id, accounts, playerIds, ownPlayerId: playerIds[1]! };
}
