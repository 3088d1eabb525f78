import { Routes } from '@angular/router';

export const rosterRoutes: Routes = [
  {
    path: '',
    title: 'Roster · Trenchwork',
    loadComponent: () => import('./roster-page').then((m) => m.RosterPage),
  },
];
