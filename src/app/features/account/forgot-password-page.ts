import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { applyServerErrors, fieldError } from '../../core/forms/field-errors';
import { hasFieldErrors, readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { AccountFrame } from './account-frame';

/** Asks for a reset link. The answer is the same whether or not the address has an account. */
@Component({
  selector: 'tw-forgot-password-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [AccountFrame, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule, RouterLink],
  template: `
    <tw-account-frame heading="Forgot password">
      @if (sentTo(); as email) {
        <div class="tw-alert tw-alert-info" role="status">
          <mat-icon aria-hidden="true">mark_email_read</mat-icon>
          <p>
            If an account uses {{ email }}, we have sent it a link to choose a new password.
            The link works for a limited time. Check the spam folder too.
          </p>
        </div>
        <p class="aside"><a routerLink="/sign-in">Back to sign-in</a></p>
      } @else {
        <p class="lead">Enter the e-mail address you sign in with. We will send you a link to choose a new password.</p>
        @if (problem(); as text) {
          <div class="tw-alert tw-alert-error" role="alert">
            <mat-icon aria-hidden="true">error_outline</mat-icon>
            <p>{{ text }}</p>
          </div>
        }
        <form class="tw-form" [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <mat-form-field>
            <mat-label>E-mail address</mat-label>
            <input matInput type="email" formControlName="email" autocomplete="username" inputmode="email" />
            <mat-error>{{ message(form.controls.email) }}</mat-error>
          </mat-form-field>
          <button mat-flat-button class="submit" type="submit" [disabled]="submitting()">
            {{ submitting() ? 'Sending…' : 'Send the link' }}
          </button>
        </form>
        <p class="aside"><a routerLink="/sign-in">Back to sign-in</a></p>
      }
    </tw-account-frame>
  `,
  styleUrl: './account-page.scss',
})
export class ForgotPasswordPage {
  private readonly http = inject(HttpClient);
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
  });
  protected readonly submitting = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly sentTo = signal<string | null>(null);
  protected readonly message = fieldError;

  protected submit(): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email } = this.form.getRawValue();
    this.submitting.set(true);
    this.http.post('/api/auth/password-reset/request', { email }, { context: inlineErrors() }).subscribe({
      next: () => {
        this.submitting.set(false);
        this.sentTo.set(email.trim());
      },
      error: (failure: unknown) => {
        this.submitting.set(false);
        const error = readApiError(failure);
        const unplaced = hasFieldErrors(error) ? applyServerErrors(this.form, error.fields) : [error.message];
        this.problem.set(unplaced[0] ?? null);
      },
    });
  }
}
