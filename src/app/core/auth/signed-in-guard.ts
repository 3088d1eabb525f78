import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { AuthStore } from './auth-store';

/** Lets signed-in users through; sends everyone else to sign-in, remembering where they were going. */
export const signedInGuard: CanActivateFn = async (_route, state) => {
  const auth = inject(AuthStore);
  const router = inject(Router);
  if (await auth.ensureLoaded()) return true;
  return router.createUrlTree(['/sign-in'], { queryParams: { next: state.url } });
};
