import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import type { Role } from '@shared/roles';
import { AuthStore } from './auth-store';

/** Allows the route when the user's role in the selected team is one of `roles`; otherwise This Week. */
export function roleGuard(roles: readonly Role[]): CanActivateFn {
  return async (_route, state) => {
    const auth = inject(AuthStore);
    const router = inject(Router);
    if (!(await auth.ensureLoaded())) {
      return router.createUrlTree(['/sign-in'], { queryParams: { next: state.url } });
    }
    const role = auth.role();
    return role !== null && roles.includes(role) ? true : router.createUrlTree(['/']);
  };
}
