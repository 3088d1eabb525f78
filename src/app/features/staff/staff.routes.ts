import { Routes } from '@angular/router';

export const staffRoutes: Routes = [
  {
    path: '',
    title: 'Staff · Trenchwork',
    loadComponent: () => import('./staff-page').then((m) => m.StaffPage),
  },
];
