import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatChipInputEvent, MatChipsModule } from '@angular/material/chips';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import type { FilmSession, FilmSessionCreate } from '@shared/api/film';
import { SESSION_KINDS, type SessionKind } from '@shared/film';
import { applyServerErrors, fieldError } from '../../core/forms/field-errors';
import { readApiError } from '../../core/http/api-error';
import { SESSION_KIND_LABELS } from './clip-states';
import { FilmApi } from './film-api';
import { suggestedTitle, type HomeAway } from './session-title';

export interface NewSessionData {
  teamId: number;
  seasonId: number | null;
  kind: SessionKind;
}

/** Common practice periods of a line room, offered as one-click additions. */
const PERIOD_IDEAS = ['inside run', '1-on-1 pass pro', 'team run', 'blitz pickup', 'screens', 'team pass'];

function today(): string {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
}

/** Adds a game, scrimmage or practice to the season. Closes with the new session. */
@Component({
  selector: 'tw-new-session-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatButtonModule,
    MatChipsModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatRadioModule,
    MatSelectModule,
    ReactiveFormsModule,
  ],
  templateUrl: './new-session-dialog.html',
  styleUrl: './new-session-dialog.scss',
})
export class NewSessionDialog {
  protected readonly data = inject<NewSessionData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<NewSessionDialog, FilmSession>>(MatDialogRef);
  private readonly api = inject(FilmApi);

  protected readonly kinds = SESSION_KINDS;
  protected readonly kindLabels = SESSION_KIND_LABELS;
  protected readonly periodIdeas = PERIOD_IDEAS;
  protected readonly message = fieldError;
  protected readonly submitting = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly periods = signal<string[]>([]);
  protected readonly periodsError = signal<string | null>(null);

  protected readonly form = new FormGroup({
    kind: new FormControl<SessionKind>(this.data.kind, { nonNullable: true }),
    title: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(120)] }),
    date: new FormControl(today(), { nonNullable: true, validators: [Validators.required] }),
    opponent: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(120)] }),
    homeAway: new FormControl<HomeAway | null>(null),
    week: new FormControl('', { nonNullable: true, validators: [Validators.pattern(/^\d+$/), Validators.min(0), Validators.max(25)] }),
  });

  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly kind = computed(() => this.values().kind ?? this.data.kind);
  protected readonly titleSuggestion = computed(() => {
    this.values(); // recomputed whenever the form changes
    const v = this.form.getRawValue();
    return suggestedTitle(v.kind, v.date, v.opponent.trim() || null, v.homeAway, /^\d+$/.test(v.week) ? Number(v.week) : null);
  });

  protected readonly weekMessages = { pattern: 'Use a whole number.', min: 'Weeks are 0–25.', max: 'Weeks are 0–25.' };

  protected addPeriod(event: MatChipInputEvent): void {
    this.pushPeriod(event.value);
    event.chipInput.clear();
  }

  protected pushPeriod(name: string): void {
    const text = name.trim();
    if (!text) return;
    this.periodsError.set(null);
    this.periods.update((list) => (list.some((p) => p.toLowerCase() === text.toLowerCase()) ? list : [...list, text.slice(0, 60)]));
  }

  protected removePeriod(name: string): void {
    this.periods.update((list) => list.filter((p) => p !== name));
  }

  protected save(): void {
    this.problem.set(null);
    const v = this.form.getRawValue();
    if (v.kind === 'game' && v.opponent.trim() === '') {
      this.form.controls.opponent.setErrors({ opponent: 'A game needs an opponent.' });
    }
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const input: FilmSessionCreate = {
      teamId: this.data.teamId,
      kind: v.kind,
      title: v.title.trim() || this.titleSuggestion(),
      date: v.date,
      ...(this.data.seasonId !== null ? { seasonId: this.data.seasonId } : {}),
      opponent: v.kind === 'practice' ? null : v.opponent.trim() || null,
      homeAway: v.kind === 'practice' ? null : v.homeAway,
      week: v.week === '' ? null : Number(v.week),
      periods: v.kind === 'practice' ? this.periods() : [],
    };
    this.submitting.set(true);
    this.api.createSession(input).subscribe({
      next: (session) => this.dialogRef.close(session),
      error: (failure: unknown) => {
        this.submitting.set(false);
        const error = readApiError(failure);
        const fields = { ...error.fields };
        if (fields['periods']) {
          this.periodsError.set(fields['periods']);
          delete fields['periods'];
        }
        const unplaced = error.status === 422 ? applyServerErrors(this.form, fields) : [];
        this.problem.set(unplaced[0] ?? (Object.keys(error.fields).length ? null : error.message));
      },
    });
  }
}
