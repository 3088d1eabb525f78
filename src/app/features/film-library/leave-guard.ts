import { inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import type { CanDeactivateFn } from '@angular/router';
import { map } from 'rxjs';
import { ConfirmDialog, ConfirmDialogData } from '../../core/feedback/confirm-dialog';

export interface HasRunningUploads {
  uploadsRunning(): boolean;
}

/** Leaving the page aborts its uploads (they are not resumable): ask first. */
export const leaveWhileUploadingGuard: CanDeactivateFn<HasRunningUploads> = (page) => {
  if (!page.uploadsRunning()) return true;
  const data: ConfirmDialogData = {
    title: 'Stop the uploads?',
    message: 'Files are still being sent. Leaving this page stops them, and they must be sent again from the start.',
    confirmLabel: 'Leave and stop them',
  };
  return inject(MatDialog)
    .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
    .afterClosed()
    .pipe(map((leave) => leave === true));
};
