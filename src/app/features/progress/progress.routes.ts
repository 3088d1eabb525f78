import { Routes } from '@angular/router';
import { STAFF_ROLES } from '@shared/roles';
import { roleGuard } from '../../core/auth/role-guard';
import { ownProgressGuard } from './own-progress-guard';

export const progressRoutes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Progress · Trenchwork',
    canActivate: [ownProgressGuard, roleGuard(STAFF_ROLES)],
    loadComponent: () => import('./progress-index-page').then((m) => m.ProgressIndexPage),
  },
  {
    // Any member may open it; the API answers a player only for his own page (403 otherwise).
    path: ':playerId',
    title: 'Progress · Trenchwork',
    loadComponent: () => import('./progress-page').then((m) => m.ProgressPage),
  },
];
