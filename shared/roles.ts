/** The five roles a member can hold in a team. One role per team per person. */
export const ROLES = ['admin', 'coordinator', 'coach', 'analyst', 'player'] as const;
export type Role = (typeof ROLES)[number];

export const STAFF_ROLES: readonly Role[] = ['admin', 'coordinator', 'coach', 'analyst'];
/** Roles that may grade film and write coaching points. Analysts tag film but do not grade. */
export const GRADING_ROLES: readonly Role[] = ['admin', 'coordinator', 'coach'];
/** Roles that manage the roster (players, jerseys, statuses). */
export const ROSTER_EDITOR_ROLES: readonly Role[] = ['admin', 'coordinator'];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Program admin',
  coordinator: 'Coordinator',
  coach: 'Position coach',
  analyst: 'Video analyst',
  player: 'Player',
};

export function isStaff(role: Role): boolean {
  return STAFF_ROLES.includes(role);
}
