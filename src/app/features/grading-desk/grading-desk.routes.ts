import { Routes } from '@angular/router';
import { roleGuard } from '../../core/auth/role-guard';

export const gradingDeskRoutes: Routes = [
  {
    path: '',
    title: 'Grading Desk · Trenchwork',
    loadComponent: () => import('./grading-sessions-page').then((m) => m.GradingSessionsPage),
  },
  {
    path: 'scheme',
    title: 'Grading scheme and sharing · Trenchwork',
    canActivate: [roleGuard(['admin', 'coordinator'])],
    loadComponent: () => import('./scheme-settings-page').then((m) => m.SchemeSettingsPage),
  },
  {
    path: ':sessionId',
    title: 'Grading Desk · Trenchwork',
    loadComponent: () => import('./grading-desk-page').then((m) => m.GradingDeskPage),
  },
];
