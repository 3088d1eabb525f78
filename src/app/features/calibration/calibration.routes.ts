import { Routes } from '@angular/router';

export const calibrationRoutes: Routes = [
  {
    path: '',
    title: 'Calibration · Trenchwork',
    loadComponent: () => import('./calibration-page').then((m) => m.CalibrationPage),
  },
];
