import { Routes } from '@angular/router';

export const positionBattleRoutes: Routes = [
  {
    path: '',
    title: 'Position Battle · Trenchwork',
    loadComponent: () => import('./position-battle-page').then((m) => m.PositionBattlePage),
  },
];
