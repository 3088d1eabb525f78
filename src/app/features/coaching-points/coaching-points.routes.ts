import { Routes } from '@angular/router';
import { STAFF_ROLES } from '@shared/roles';
import { roleGuard } from '../../core/auth/role-guard';

/**
 * Staff film-room pages that live under a film session's address. Listed in the shell's children
 * before the Film Library's own routes.
 */
export const coachingPointRoutes: Routes = [
  {
    path: 'film/:sessionId/clips/:clipId/points',
    title: 'Coaching points · Trenchwork',
    canActivate: [roleGuard(STAFF_ROLES)],
    loadComponent: () => import('./coaching-points-page').then((m) => m.CoachingPointsPage),
  },
  {
    path: 'film/:sessionId/study-report',
    title: 'Study Report · Trenchwork',
    canActivate: [roleGuard(STAFF_ROLES)],
    loadComponent: () => import('./study-report-page').then((m) => m.StudyReportPage),
  },
];
