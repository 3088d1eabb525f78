import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

/** Unlocking a graded session needs a reason; it goes into the lock history. Closes with the reason. */
@Component({
  selector: 'tw-unlock-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Unlock grading</h2>
    <mat-dialog-content class="tw-form">
      <p>Coaches can change grades again once it is unlocked. Say why, for the lock history.</p>
      <mat-form-field>
        <mat-label>Reason</mat-label>
        <textarea matInput rows="2" maxlength="300" required [value]="reason()" (input)="reason.set($any($event.target).value)"></textarea>
        @if (tried() && !reason().trim()) {
          <mat-hint class="field-error">Enter a reason.</mat-hint>
        }
      </mat-form-field>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Keep it locked</button>
      <button mat-flat-button type="button" (click)="confirm()">Unlock</button>
    </mat-dialog-actions>
  `,
  styles: `.field-error { color: var(--mat-sys-error); }`,
})
export class UnlockDialog {
  private readonly ref = inject<MatDialogRef<UnlockDialog, string>>(MatDialogRef);
  protected readonly reason = signal('');
  protected readonly tried = signal(false);

  protected confirm(): void {
    this.tried.set(true);
    const reason = this.reason().trim();
    if (reason) this.ref.close(reason);
  }
}
