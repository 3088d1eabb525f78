import { Routes } from '@angular/router';
import { GRADING_ROLES, STAFF_ROLES } from '@shared/roles';
import { roleGuard } from './core/auth/role-guard';
import { signedInGuard } from './core/auth/signed-in-guard';
import { signedOutGuard } from './core/auth/signed-out-guard';
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
    ],
  },
  {
    path: '**',
    title: 'Not found · Trenchwork',
    loadComponent: () => import('./features/not-found/not-found-page').then((m) => m.NotFoundPage),
  },
];
