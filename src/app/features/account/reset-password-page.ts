import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';
import { applyServerErrors } from '../../core/forms/field-errors';
import { hasFieldErrors, readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { AccountFrame } from './account-frame';
import { NewPasswordFields, newPasswordGroup } from './new-password-fields';

/** Opened from the reset mail: /reset-password?token=… */
@Component({
  selector: 'tw-reset-password-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [AccountFrame, MatButtonModule, MatIconModule, NewPasswordFields, ReactiveFormsModule, RouterLink],
  template: `
    <tw-account-frame heading="Choose a new password">
      @if (!token() || linkDead()) {
        <div class="tw-alert tw-alert-attention" role="alert">
          <mat-icon aria-hidden="true">link_off</mat-icon>
          <p>
            {{ linkDead() ?? 'This link is incomplete. Open the link from the e-mail again, or ask for a new one.' }}
          </p>
        </div>
        <p class="aside"><a routerLink="/forgot-password">Ask for a new link</a></p>
      } @else {
        @if (problem(); as text) {
          <div class="tw-alert tw-alert-error" role="alert">
            <mat-icon aria-hidden="true">error_outline</mat-icon>
            <p>{{ text }}</p>
          </div>
        }
        <form class="tw-form" [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <tw-new-password-fields [group]="form" />
          <button mat-flat-button class="submit" type="submit" [disabled]="submitting()">
            {{ submitting() ? 'Saving…' : 'Save the new password' }}
          </button>
        </form>
      }
    </tw-account-frame>
  `,
  styleUrl: './account-page.scss',
})
export class ResetPasswordPage {
  readonly token = input<string>();
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  protected readonly form = newPasswordGroup();
  protected readonly submitting = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** Set when the server says the token is expired, used or unknown. */
  protected readonly linkDead = signal<string | null>(null);

  protected submit(): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    const body = { token: this.token(), password: this.form.controls.password.value };
    this.http.post('/api/auth/password-reset/confirm', body, { context: inlineErrors() }).subscribe({
      next: () => void this.router.navigate(['/sign-in'], { queryParams: { notice: 'reset' } }),
      error: (failure: unknown) => {
        this.submitting.set(false);
        const error = readApiError(failure);
        if (error.code === 'token_invalid') {
          this.linkDead.set(error.message);
          return;
        }
        const unplaced = hasFieldErrors(error) ? applyServerErrors(this.form, error.fields) : [error.message];
        this.problem.set(unplaced[0] ?? null);
      },
    });
  }
}
