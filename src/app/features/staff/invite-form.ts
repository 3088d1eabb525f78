import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Player } from '@shared/api/roster';
import type { Invitation } from '@shared/api/team';
import { ROLES, ROLE_LABELS, type Role } from '@shared/roles';
import { Notifier } from '../../core/feedback/notifier';
import { applyServerErrors, fieldError } from '../../core/forms/field-errors';
import { hasFieldErrors, readApiError } from '../../core/http/api-error';
import { StaffApi } from './staff-api';

function requiredForPlayers(control: AbstractControl): ValidationErrors | null {
  return control.parent?.get('role')?.value === 'player' && control.value == null
    ? { required: 'Choose the roster entry this account belongs to.' }
    : null;
}

/** Invite someone by e-mail; a player invitation is tied to his roster entry. */
@Component({
  selector: 'tw-invite-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './invite-form.html',
  styleUrl: './invite-form.scss',
})
export class InviteForm {
  readonly teamId = input.required<number>();
  /** This season's roster, to pick the entry a player invitation belongs to. */
  readonly players = input.required<Player[]>();
  readonly pending = input.required<Invitation[]>();
  readonly invited = output<Invitation>();

  private readonly api = inject(StaffApi);
  private readonly notifier = inject(Notifier);
  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly message = fieldError;

  protected readonly form = new FormGroup({
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email, Validators.maxLength(254)] }),
    role: new FormControl<Role>('coach', { nonNullable: true }),
    playerId: new FormControl<number | null>(null, { validators: [requiredForPlayers] }),
  });
  protected readonly role = signal<Role>('coach');
  protected readonly submitting = signal(false);
  protected readonly problem = signal<string | null>(null);

  /** Roster entries that could still get an account: none linked, none invited, not inactive. */
  protected readonly openEntries = computed(() => {
    const invited = new Set(this.pending().map((i) => i.playerId));
    return this.players()
      .filter((p) => p.accountEmail === null && p.status !== 'inactive' && !invited.has(p.id))
      .sort((a, b) => a.jersey - b.jersey);
  });

  protected roleChanged(role: Role): void {
    this.role.set(role);
    if (role !== 'player') this.form.controls.playerId.setValue(null);
    this.form.controls.playerId.updateValueAndValidity();
  }

  protected submit(): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, role, playerId } = this.form.getRawValue();
    const body = role === 'player' && playerId !== null ? { email: email.trim(), role, playerId } : { email: email.trim(), role };
    this.submitting.set(true);
    this.api.invite(this.teamId(), body).subscribe({
      next: (invitation) => {
        this.submitting.set(false);
        this.notifier.info(`Invitation sent to ${invitation.email}.`);
        this.form.reset({ email: '', role: 'coach', playerId: null });
        this.role.set('coach');
        this.invited.emit(invitation);
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
