import { Routes } from '@angular/router';

/** Staff cut-ups: the list, the builder (new or edit), and playing one as a player would. */
export const cutupRoutes: Routes = [
  {
    path: '',
    title: 'Cut-ups · Trenchwork',
    loadComponent: () => import('./cutup-list-page').then((m) => m.CutupListPage),
  },
  {
    path: 'new',
    title: 'New cut-up · Trenchwork',
    loadComponent: () => import('./cutup-builder-page').then((m) => m.CutupBuilderPage),
  },
  {
    path: ':cutupId',
    title: 'Cut-up · Trenchwork',
    loadComponent: () => import('./cutup-builder-page').then((m) => m.CutupBuilderPage),
  },
  {
    path: ':cutupId/play',
    title: 'Play cut-up · Trenchwork',
    loadComponent: () => import('./cutup-reel-page').then((m) => m.CutupReelPage),
  },
];
