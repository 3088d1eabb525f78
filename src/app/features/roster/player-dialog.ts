import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Player, PlayerInput } from '@shared/api/roster';
import {
  CLASS_YEARS,
  CLASS_YEAR_LABELS,
  JERSEY_MAX,
  JERSEY_MIN,
  PLAYER_STATUSES,
  POSITIONS,
  formatHeight,
  parseHeight,
  type ClassYear,
  type PlayerStatus,
  type Position,
} from '@shared/roster';
import { applyServerErrors, fieldError } from '../../core/forms/field-errors';
import { readApiError } from '../../core/http/api-error';
import { RosterApi } from './roster-api';
import { STATUS_LABELS } from './status-labels';

export interface PlayerDialogData {
  teamId: number;
  seasonId: number | null;
  /** null to add a new player. */
  player: Player | null;
}

// The API names fields as the schema does; the form uses the words coaches type.
const SERVER_FIELD_TO_CONTROL: Record<string, string> = { heightIn: 'height', weightLb: 'weight' };

function heightValidator(control: AbstractControl): ValidationErrors | null {
  const text = String(control.value ?? '').trim();
  if (text === '') return null;
  const inches = parseHeight(text);
  if (inches === null) return { height: 'Write the height like 6-4, or in inches like 76.' };
  return inches < 48 || inches > 96 ? { height: 'That height looks wrong.' } : null;
}

const wholeNumber = Validators.pattern(/^\d+$/);

/** Add or edit one roster entry. Closes with the saved player. */
@Component({
  selector: 'tw-player-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatButtonModule,
    MatCheckboxModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    ReactiveFormsModule,
  ],
  templateUrl: './player-dialog.html',
  styleUrl: './player-dialog.scss',
})
export class PlayerDialog {
  protected readonly data = inject<PlayerDialogData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<PlayerDialog, Player>>(MatDialogRef);
  private readonly api = inject(RosterApi);

  protected readonly positions = POSITIONS;
  protected readonly classYears = CLASS_YEARS;
  protected readonly classLabels = CLASS_YEAR_LABELS;
  protected readonly statuses = PLAYER_STATUSES;
  protected readonly statusLabels = STATUS_LABELS;
  protected readonly message = fieldError;
  protected readonly submitting = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected readonly form = new FormGroup({
    name: new FormControl(this.data.player?.name ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    jersey: new FormControl(this.data.player ? String(this.data.player.jersey) : '', {
      nonNullable: true,
      validators: [Validators.required, wholeNumber, Validators.min(JERSEY_MIN), Validators.max(JERSEY_MAX)],
    }),
    positions: new FormControl<Position[]>(this.data.player?.positions ?? [], { nonNullable: true, validators: [Validators.required] }),
    classYear: new FormControl<ClassYear | ''>(this.data.player?.classYear ?? '', { nonNullable: true, validators: [Validators.required] }),
    redshirt: new FormControl(this.data.player?.redshirt ?? false, { nonNullable: true }),
    height: new FormControl(formatHeight(this.data.player?.heightIn), { nonNullable: true, validators: [heightValidator] }),
    weight: new FormControl(this.data.player?.weightLb == null ? '' : String(this.data.player.weightLb), {
      nonNullable: true,
      validators: [wholeNumber, Validators.min(100), Validators.max(500)],
    }),
    status: new FormControl<PlayerStatus>(this.data.player?.status ?? 'active', { nonNullable: true }),
  });

  protected readonly jerseyMessages = {
    required: 'Enter the jersey number.',
    pattern: 'Use a whole number.',
    min: `Jersey numbers are ${JERSEY_MIN}–${JERSEY_MAX}.`,
    max: `Jersey numbers are ${JERSEY_MIN}–${JERSEY_MAX}.`,
  };
  protected readonly weightMessages = { pattern: 'Pounds, as a whole number.', min: 'That weight looks wrong.', max: 'That weight looks wrong.' };

  protected save(): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const input = this.toInput();
    const { teamId, seasonId, player } = this.data;
    const request = player
      ? this.api.update(teamId, player.id, input)
      : this.api.create(teamId, seasonId === null ? input : { ...input, seasonId });
    this.submitting.set(true);
    request.subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (failure: unknown) => {
        this.submitting.set(false);
        const error = readApiError(failure);
        if (error.status === 409 && error.code === 'conflict') {
          // Jersey already worn by someone else this season.
          applyServerErrors(this.form, { jersey: error.fields['jersey'] ?? error.message });
          return;
        }
        const unplaced = error.status === 422 ? applyServerErrors(this.form, error.fields, SERVER_FIELD_TO_CONTROL) : [];
        this.problem.set(unplaced[0] ?? (Object.keys(error.fields).length ? null : error.message));
      },
    });
  }

  private toInput(): PlayerInput {
    const v = this.form.getRawValue();
    return {
      name: v.name.trim(),
      jersey: Number(v.jersey),
      positions: POSITIONS.filter((p) => v.positions.includes(p)),
      classYear: v.classYear as ClassYear,
      redshirt: v.redshirt,
      heightIn: v.height.trim() === '' ? null : parseHeight(v.height),
      weightLb: v.weight.trim() === '' ? null : Number(v.weight),
      status: v.status,
    };
  }
}
