import { Routes } from '@angular/router';

export const gradeSheetRoutes: Routes = [
  {
    path: ':sessionId',
    title: 'Grade Sheet · Trenchwork',
    loadComponent: () => import('./grade-sheet-page').then((m) => m.GradeSheetPage),
  },
];
