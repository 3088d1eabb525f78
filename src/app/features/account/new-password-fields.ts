import { ChangeDetectionStrategy, Component, input, signal } from '@angular/core';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { ShowOnDirtyErrorStateMatcher } from '@angular/material/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from '@shared/passwords';
import { fieldError } from '../../core/forms/field-errors';
import { passwordPolicyValidator } from '../../core/forms/password-validator';

export type NewPasswordGroup = FormGroup<{ password: FormControl<string>; confirm: FormControl<string> }>;

/** A password and its repetition, checked against the shared policy while the user types. */
export function newPasswordGroup(): NewPasswordGroup {
  return new FormGroup(
    {
      password: new FormControl('', {
        nonNullable: true,
        validators: [Validators.required, Validators.maxLength(PASSWORD_MAX_LENGTH), passwordPolicyValidator],
      }),
      confirm: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    },
    { validators: confirmMatches },
  );
}

function confirmMatches(group: AbstractControl): ValidationErrors | null {
  const confirm = group.get('confirm');
  const mismatch = confirm?.value !== '' && group.get('password')?.value !== confirm?.value;
  // The error sits on the confirm field so it shows next to it.
  if (confirm) {
    const { mismatch: _old, ...others } = confirm.errors ?? {};
    const next = mismatch ? { ...others, mismatch: 'The two passwords differ.' } : others;
    confirm.setErrors(Object.keys(next).length ? next : null, { emitEvent: false });
  }
  return null;
}

@Component({
  selector: 'tw-new-password-fields',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <ng-container [formGroup]="group()">
      <mat-form-field>
        <mat-label>{{ label() }}</mat-label>
        <input
          matInput
          formControlName="password"
          autocomplete="new-password"
          [type]="shown() ? 'text' : 'password'"
          [errorStateMatcher]="liveCheck"
        />
        <button
          mat-icon-button
          matSuffix
          type="button"
          [attr.aria-label]="shown() ? 'Hide password' : 'Show password'"
          [attr.aria-pressed]="shown()"
          (click)="shown.set(!shown())"
        >
          <mat-icon aria-hidden="true">{{ shown() ? 'visibility_off' : 'visibility' }}</mat-icon>
        </button>
        <mat-hint>At least {{ minLength }} characters. Very common passwords are refused.</mat-hint>
        <mat-error>{{ message(group().controls.password) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Repeat the password</mat-label>
        <input
          matInput
          formControlName="confirm"
          autocomplete="new-password"
          [type]="shown() ? 'text' : 'password'"
          [errorStateMatcher]="liveCheck"
        />
        <mat-error>{{ message(group().controls.confirm) }}</mat-error>
      </mat-form-field>
    </ng-container>
  `,
  styles: `
    mat-form-field {
      width: 100%;
    }
  `,
})
export class NewPasswordFields {
  readonly group = input.required<NewPasswordGroup>();
  readonly label = input('New password');
  protected readonly shown = signal(false);
  protected readonly minLength = PASSWORD_MIN_LENGTH;
  // Policy feedback while typing, not only after leaving the field.
  protected readonly liveCheck = new ShowOnDirtyErrorStateMatcher();
  protected readonly message = fieldError;
}
