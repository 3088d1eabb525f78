import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { PASSWORD_MAX_LENGTH } from '@shared/passwords';
import { AuthStore } from '../../core/auth/auth-store';
import { safeNextUrl } from '../../core/auth/next-url';
import { applyServerErrors, fieldError } from '../../core/forms/field-errors';
import { hasFieldErrors, readApiError } from '../../core/http/api-error';
import { AccountFrame } from './account-frame';

// Only known notices are shown, so a link cannot put arbitrary text on our sign-in page.
const NOTICES: Record<string, string> = {
  joined: 'Your account is ready. Sign in with your e-mail address and the password you chose.',
  reset: 'Your password is changed. Sign in with the new one.',
  'signed-out': 'You are signed out.',
  expired: 'Your session has ended. Sign in again to continue where you were.',
};

@Component({
  selector: 'tw-sign-in-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    AccountFrame,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './sign-in-page.html',
  styleUrl: './account-page.scss',
})
export class SignInPage {
  /** Query parameters, bound by the router. */
  readonly next = input<string>();
  readonly notice = input<string>();

  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
    password: ['', [Validators.required, Validators.maxLength(PASSWORD_MAX_LENGTH)]],
  });
  protected readonly submitting = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly shown = signal(false);
  protected readonly noticeText = computed(() => NOTICES[this.notice() ?? ''] ?? null);
  protected readonly message = fieldError;

  protected submit(): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    this.auth.signIn(this.form.getRawValue()).subscribe({
      next: () => {
        this.submitting.set(false);
        void this.router.navigateByUrl(safeNextUrl(this.next()));
      },
      error: (failure: unknown) => {
        this.submitting.set(false);
        const error = readApiError(failure);
        // 401 wrong e-mail or password, 429 too many tries (the message says when to retry).
        const unplaced = hasFieldErrors(error) ? applyServerErrors(this.form, error.fields) : [error.message];
        this.problem.set(unplaced[0] ?? null);
      },
    });
  }
}
