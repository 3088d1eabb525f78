import { inject } from '@angular/core';
import type { CanActivateFn } from '@angular/router';
import { Router } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';

/** The player's "Progress" link: a player goes straight to his own page; staff stay on the list of players. */
export const ownProgressGuard: CanActivateFn = async () => {
  const auth = inject(AuthStore);
  const router = inject(Router);
  await auth.ensureLoaded();
  if (auth.role() !== 'player') return true;
  const playerId = auth.membership()?.playerId;
  return playerId === undefined ? router.createUrlTree(['/']) : router.createUrlTree(['/progress', playerId]);
};
