import type { TeamSharing } from '@shared/api/team';
import { GRADING_ROLES, STAFF_ROLES, type Role } from '@shared/roles';

export interface NavLink {
  path: string;
  label: string;
  icon: string;
}

const LINKS: { link: NavLink; roles: readonly Role[] }[] = [
  { link: { path: '/', label: 'This Week', icon: 'today' }, roles: ['admin', 'coordinator', 'coach', 'analyst', 'player'] },
  { link: { path: '/study', label: 'Study Queue', icon: 'school' }, roles: ['player'] },
  { link: { path: '/progress', label: 'Progress', icon: 'insights' }, roles: ['player'] },
  { link: { path: '/film', label: 'Film Library', icon: 'video_library' }, roles: STAFF_ROLES },
  { link: { path: '/grading', label: 'Grading Desk', icon: 'grading' }, roles: GRADING_ROLES },
  { link: { path: '/cutups', label: 'Cut-ups', icon: 'playlist_play' }, roles: GRADING_ROLES },
  { link: { path: '/readiness', label: 'Readiness Grid', icon: 'grid_on' }, roles: STAFF_ROLES },
  { link: { path: '/depth-chart', label: 'Depth Chart', icon: 'format_list_numbered' }, roles: STAFF_ROLES },
  { link: { path: '/position-battle', label: 'Position Battle', icon: 'compare_arrows' }, roles: STAFF_ROLES },
  { link: { path: '/calibration', label: 'Calibration', icon: 'balance' }, roles: GRADING_ROLES },
  { link: { path: '/roster', label: 'Roster', icon: 'groups' }, roles: STAFF_ROLES },
  { link: { path: '/staff', label: 'Staff', icon: 'badge' }, roles: ['admin'] },
  { link: { path: '/settings/mail', label: 'Mail settings', icon: 'mark_email_read' }, roles: ['admin', 'coordinator', 'coach', 'analyst', 'player'] },
];

/** Staff pages a player may open too while his team shares that switch (roleGuard's `playersWhen`). */
const SHARED_WITH_PLAYERS = new Map<string, keyof TeamSharing>([['/readiness', 'unitWithPlayers']]);

/** The side navigation for a role in the selected team (and what the team shares). Route guards enforce the same rule. */
export function navLinksFor(role: Role | null, sharing: TeamSharing | null = null): NavLink[] {
  if (role === null) return [];
  const sharedWithPlayer = (path: string) => {
    const setting = SHARED_WITH_PLAYERS.get(path);
    return role === 'player' && setting !== undefined && sharing?.[setting] === true;
  };
  return LINKS.filter((entry) => entry.roles.includes(role) || sharedWithPlayer(entry.link.path)).map((entry) => entry.link);
}

/** Whether `url` stays reachable after switching to a team where the user holds `role`. */
export function urlAllowedFor(role: Role | null, url: string, sharing: TeamSharing | null = null): boolean {
  const path = url.split(/[?#]/)[0];
  return navLinksFor(role, sharing).some((link) => (link.path === '/' ? path === '/' : path === link.path || path.startsWith(`${link.path}/`)));
}
