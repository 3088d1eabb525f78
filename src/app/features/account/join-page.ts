import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import type { InvitationPreview } from '@shared/api/auth';
import { PASSWORD_MAX_LENGTH } from '@shared/passwords';
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

  /** A new address: name and a new password, checked against the policy. */
  protected readonly newAccount = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    passwords: newPasswordGroup(),
  });
  /** An address that already has an account confirms with that account's password. */
  protected readonly existingAccount = new FormGroup({
    password: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(PASSWORD_MAX_LENGTH)] }),
  });
  protected readonly submitting = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly shown = signal(false);

  protected submit(invite: InvitationPreview): void {
    this.problem.set(null);
    const form = invite.hasAccount ? this.existingAccount : this.newAccount;
    if (form.invalid) {
      form.markAllAsTouched();
      return;
    }
    const body = invite.hasAccount
      ? // The API keeps the existing account's name; the schema still wants one, so the address stands in.
        { token: this.token(), name: invite.email.slice(0, 120), password: this.existingAccount.controls.password.value }
      : {
          token: this.token(),
          name: this.newAccount.controls.name.value.trim(),
          password: this.newAccount.controls.passwords.controls.password.value,
        };
    this.submitting.set(true);
    this.http.post('/api/invitations/accept', body, { context: inlineErrors() }).subscribe({
      next: () => void this.router.navigate(['/sign-in'], { queryParams: { notice: 'joined' } }),
      error: (failure: unknown) => {
        this.submitting.set(false);
        const error = readApiError(failure);
        const aliases: Record<string, string> = invite.hasAccount ? {} : { password: 'passwords.password' };
        const unplaced = hasFieldErrors(error) ? applyServerErrors(form, error.fields, aliases) : [error.message];
        this.problem.set(unplaced[0] ?? null);
      },
    });
  }
}
