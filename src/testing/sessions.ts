import type { MeResponse } from '@shared/api/auth';
import type { Role } from '@shared/roles';

/** A signed-in user with one role in the invented demo team (and optionally a second team). */
export function sessionFor(role: Role, extraTeams: { teamId: number; teamName: string; role: Role }[] = []): MeResponse {
  return {
    user: { id: 7, email: 'dana.keel@ironvale.test', name: 'Dana Keel' },
    memberships: [{ teamId: 1, teamName: 'Ironvale Anvils', role, ...(role === 'player' ? { playerId: 74 } : {}) }, ...extraTeams],
  };
}
