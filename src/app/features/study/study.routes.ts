import { Routes } from '@angular/router';

/** The player's film room: his Study Queue, one clip with its points, his own Grade Sheet of a session, and cut-ups shared with him. */
export const studyRoutes: Routes = [
  {
    path: '',
    title: 'Study · Trenchwork',
    loadComponent: () => import('./study-queue-page').then((m) => m.StudyQueuePage),
  },
  {
    path: 'clips/:clipId',
    title: 'Clip · Study · Trenchwork',
    loadComponent: () => import('./study-clip-page').then((m) => m.StudyClipPage),
  },
  {
    path: 'sheets/:sessionId',
    title: 'My Grade Sheet · Study · Trenchwork',
    loadComponent: () => import('./my-grade-sheet-page').then((m) => m.MyGradeSheetPage),
  },
  {
    path: 'cutups/:cutupId',
    title: 'Cut-up · Study · Trenchwork',
    loadComponent: () => import('../cutups/cutup-reel-page').then((m) => m.CutupReelPage),
  },
];
