import { HttpClient } from '@angular/common/http';
import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { Team, TeamSharing } from '@shared/api/team';
import type { Role } from '@shared/roles';
import { inlineErrors } from '../http/inline-errors';
import { AuthStore } from './auth-store';

/**
 * Allows the route when the user's role in the selected team is one of `roles`; otherwise This Week.
 * With `playersWhen`, a player is let in too while his team has that sharing switch on (the side
 * navigation offers him the link on the same rule, see nav-links.ts).
 */
export function roleGuard(roles: readonly Role[], playersWhen?: keyof TeamSharing): CanActivateFn {
  return async (_route, state) => {
    const auth = inject(AuthStore);
    const router = inject(Router);
    const http = inject(HttpClient);
    if (!(await auth.ensureLoaded())) {
      return router.createUrlTree(['/sign-in'], { queryParams: { next: state.url } });
    }
    const role = auth.role();
    if (role !== null && roles.includes(role)) return true;
    const teamId = auth.teamId();
    if (role === 'player' && playersWhen !== undefined && teamId !== null) {
      // Asked fresh: the switch may have changed since the page loaded; the API refuses anyway when it is off.
      const team = await firstValueFrom(http.get<Team>(`/api/teams/${teamId}`, { context: inlineErrors() })).catch(() => null);
      if (team?.sharing[playersWhen] === true) return true;
    }
    return router.createUrlTree(['/']);
  };
}
