import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { AuthStore } from './auth-store';
import { safeNextUrl } from './next-url';

/** Someone already signed in who opens /sign-in goes straight to the page they asked for. */
export const signedOutGuard: CanActivateFn = async (route) => {
  const auth = inject(AuthStore);
  const router = inject(Router);
  if (!(await auth.ensureLoaded())) return true;
  return router.parseUrl(safeNextUrl(route.queryParamMap.get('next')));
};
