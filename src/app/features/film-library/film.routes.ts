import { Routes } from '@angular/router';
import { leaveWhileUploadingGuard } from './leave-guard';

export const filmRoutes: Routes = [
  {
    path: '',
    title: 'Film Library · Trenchwork',
    loadComponent: () => import('./film-library-page').then((m) => m.FilmLibraryPage),
  },
  {
    path: ':sessionId',
    title: 'Film session · Trenchwork',
    canDeactivate: [leaveWhileUploadingGuard],
    loadComponent: () => import('./session-page').then((m) => m.SessionPage),
  },
  {
    path: ':sessionId/tape/:clipId',
    title: 'Cut Planner · Trenchwork',
    loadComponent: () => import('../cut-planner/cut-planner-page').then((m) => m.CutPlannerPage),
  },
];
