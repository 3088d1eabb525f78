import { Routes } from '@angular/router';

export const readinessRoutes: Routes = [
  {
    path: '',
    title: 'Readiness Grid · Trenchwork',
    loadComponent: () => import('./readiness-page').then((m) => m.ReadinessPage),
  },
];
