import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import type { InvitationPreview } from '@shared/api/auth';
import { ROLE_LABELS } from '@shared/roles';
import { StatePanel } from '../../core/feedback/state-panel';
import { applyServerErrors, fieldError } from '../../core/forms/field-errors';
import { hasFieldErrors, readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { AccountFrame } from './account-frame';
import { NewPasswordFields, newPasswordGroup } from './new-password-fields';

/** Opened from the invitation mail: /join?token=… Shows what the invitation is for, then sets up the account. */
@Component({
  selector: 'tw-join-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    AccountFrame,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    NewPasswordFields,
    ReactiveFormsModule,
    RouterLink,
    StatePanel,
  ],
  templateUrl: './join-page.html',
  styleUrl: './account-page.scss',
})
export class JoinPage {
  readonly token = input<string>();
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly message = fieldError;

  protected readonly invitation = httpResource<InvitationPreview>(() => {
    const token = this.token();
    return token ? { url: `/api/invitations/${encodeURIComponent(token)}`, context: inlineErrors() } : undefined;
  });

  protected readonly form = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    passwords: newPasswordGroup(),
  });
  protected readonly submitting = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected submit(): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    const body = { token: this.token(), name: this.form.controls.name.value.trim(), password: this.form.controls.passwords.controls.password.value };
    this.http.post('/api/invitations/accept', body, { context: inlineErrors() }).subscribe({
      next: () => void this.router.navigate(['/sign-in'], { queryParams: { notice: 'joined' } }),
      error: (failure: unknown) => {
        this.submitting.set(false);
        const error = readApiError(failure);
        const unplaced = hasFieldErrors(error)
          ? applyServerErrors(this.form, error.fields, { password: 'passwords.password' })
          : [error.message];
        this.problem.set(unplaced[0] ?? null);
      },
    });
  }
}
