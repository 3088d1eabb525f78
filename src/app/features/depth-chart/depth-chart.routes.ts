import { Routes } from '@angular/router';

export const depthChartRoutes: Routes = [
  {
    path: '',
    title: 'Depth Chart · Trenchwork',
    loadComponent: () => import('./depth-chart-page').then((m) => m.DepthChartPage),
  },
];
