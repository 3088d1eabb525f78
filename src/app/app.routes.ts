import { Routes } from '@angular/router';
import { GRADING_ROLES, STAFF_ROLES } from '@shared/roles';
import { roleGuard } from './core/auth/role-guard';
import { signedInGuard } from './core/auth/signed-in-guard';
import { signedOutGuard } from './core/auth/signed-out-guard';
import { coachingPointRoutes } from './features/coaching-points/coaching-points.routes';
import { devMailGuard } from './features/dev-mailbox/dev-mail-guard';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Trenchwork',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./features/account/sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: 'forgot-password',
    title: 'Forgot password · Trenchwork',
    loadComponent: () => import('./features/account/forgot-password-page').then((m) => m.ForgotPasswordPage),
  },
  {
    path: 'reset-password',
    title: 'New password · Trenchwork',
    loadComponent: () => import('./features/account/reset-password-page').then((m) => m.ResetPasswordPage),
  },
  {
    path: 'join',
    title: 'Join your team · Trenchwork',
    loadComponent: () => import('./features/account/join-page').then((m) => m.JoinPage),
  },
  {
    // Public on purpose: in development the invitation mail must be readable before an account exists.
    path: 'dev/mailbox',
    title: 'Dev mailbox · Trenchwork',
    canMatch: [devMailGuard],
    loadComponent: () => import('./features/dev-mailbox/mailbox-page').then((m) => m.MailboxPage),
  },
  {
    // Public on purpose: opened from a mail without signing in; only its button changes anything.
    path: 'mail/unsubscribe',
    title: 'Stop a mail · Trenchwork',
    loadComponent: () => import('./features/mail-settings/unsubscribe-page').then((m) => m.UnsubscribePage),
  },
  {
    path: '',
    canActivate: [signedInGuard],
    loadComponent: () => import('./core/shell/app-shell').then((m) => m.AppShell),
    children: [
      {
        path: '',
        pathMatch: 'full',
        title: 'This Week · Trenchwork',
        loadComponent: () => import('./features/this-week/this-week-page').then((m) => m.ThisWeekPage),
      },
      ...coachingPointRoutes,
      {
        path: 'film',
        canActivate: [roleGuard(STAFF_ROLES)],
        loadChildren: () => import('./features/film-library/film.routes').then((m) => m.filmRoutes),
      },
      {
        path: 'grading',
        canActivate: [roleGuard(GRADING_ROLES)],
        loadChildren: () => import('./features/grading-desk/grading-desk.routes').then((m) => m.gradingDeskRoutes),
      },
      {
        path: 'sheets',
        canActivate: [roleGuard(STAFF_ROLES)],
        loadChildren: () => import('./features/grade-sheet/grade-sheet.routes').then((m) => m.gradeSheetRoutes),
      },
      {
        path: 'roster',
        canActivate: [roleGuard(STAFF_ROLES)],
        loadChildren: () => import('./features/roster/roster.routes').then((m) => m.rosterRoutes),
      },
      {
        path: 'staff',
        canActivate: [roleGuard(['admin'])],
        loadChildren: () => import('./features/staff/staff.routes').then((m) => m.staffRoutes),
      },
      {
        // Any member: a player is sent to his own page; the API answers a player for his own only.
        path: 'progress',
        loadChildren: () => import('./features/progress/progress.routes').then((m) => m.progressRoutes),
      },
      {
        // Players too, read only, while the team shares the line's numbers (the nav follows the same rule).
        path: 'readiness',
        canActivate: [roleGuard(STAFF_ROLES, 'unitWithPlayers')],
        loadChildren: () => import('./features/readiness/readiness.routes').then((m) => m.readinessRoutes),
      },
      {
        path: 'depth-chart',
        canActivate: [roleGuard(STAFF_ROLES)],
        loadChildren: () => import('./features/depth-chart/depth-chart.routes').then((m) => m.depthChartRoutes),
      },
      {
        path: 'position-battle',
        canActivate: [roleGuard(STAFF_ROLES)],
        loadChildren: () => import('./features/position-battle/position-battle.routes').then((m) => m.positionBattleRoutes),
      },
      {
        path: 'calibration',
        canActivate: [roleGuard(GRADING_ROLES)],
        loadChildren: () => import('./features/calibration/calibration.routes').then((m) => m.calibrationRoutes),
      },
      {
        path: 'study',
        canActivate: [roleGuard(['player'])],
        loadChildren: () => import('./features/study/study.routes').then((m) => m.studyRoutes),
      },
      {
        path: 'cutups',
        canActivate: [roleGuard(GRADING_ROLES)],
        loadChildren: () => import('./features/cutups/cutups.routes').then((m) => m.cutupRoutes),
      },
      {
        path: 'settings/mail',
        title: 'Mail settings · Trenchwork',
        loadComponent: () => import('./features/mail-settings/mail-settings-page').then((m) => m.MailSettingsPage),
      },
    ],
  },
  {
    path: '**',
    title: 'Not found · Trenchwork',
    loadComponent: () => import('./features/not-found/not-found-page').then((m) => m.NotFoundPage),
  },
];
