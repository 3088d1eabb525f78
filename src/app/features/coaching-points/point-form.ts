import { ChangeDetectionStrategy, Component, ElementRef, computed, effect, inject, input, output, signal, untracked, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Comment } from '@shared/api/film-room';
import { formatClock } from '@shared/film';
import { COMMENT_KIND_LABELS, POINT_KINDS, type PointKind } from '@shared/film-room';
import { Notifier } from '../../core/feedback/notifier';
import { applyServerErrors, fieldError } from '../../core/forms/field-errors';
import { readApiError } from '../../core/http/api-error';
import { CommentsApi, PointCreate } from './comments-api';
import { COMMENT_KIND_ICONS } from './point-labels';

export interface PointPlayer {
  playerId: number;
  name: string;
  jersey: number | null;
}

export interface PointComponentOption {
  key: string;
  label: string;
}

/**
 * Writes a coaching point on a clip: for which players, at which moment (or over which span), what
 * kind, which part of the grade, and the words. The page passes the video's current time.
 */
@Component({
  selector: 'tw-point-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './point-form.html',
  styleUrl: './point-form.scss',
})
export class PointForm {
  readonly clipId = input.required<number>();
  /** The players on this snap first (picked by default), then the rest of the roster. */
  readonly onSnap = input<readonly PointPlayer[]>([]);
  readonly others = input<readonly PointPlayer[]>([]);
  readonly components = input<readonly PointComponentOption[]>([]);
  readonly currentMs = input(0);
  readonly created = output<Comment>();

  private readonly api = inject(CommentsApi);
  private readonly notifier = inject(Notifier);
  private readonly bodyField = viewChild<ElementRef<HTMLTextAreaElement>>('bodyField');

  protected readonly kinds = POINT_KINDS;
  protected readonly kindLabels = COMMENT_KIND_LABELS;
  protected readonly kindIcons = COMMENT_KIND_ICONS;
  protected readonly clock = formatClock;
  protected readonly message = fieldError;

  protected readonly form = new FormGroup({
    playerIds: new FormControl<number[]>([], { nonNullable: true, validators: [Validators.required] }),
    kind: new FormControl<PointKind>('teaching', { nonNullable: true }),
    component: new FormControl<string>('', { nonNullable: true }),
    body: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(2000)] }),
  });

  protected readonly atMs = signal(0);
  protected readonly endMs = signal<number | null>(null);
  protected readonly submitting = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly spanError = computed(() => {
    const end = this.endMs();
    return end !== null && end <= this.atMs() ? 'The span must end after it starts.' : null;
  });

  private readonly pickedIds = toSignal(this.form.controls.playerIds.valueChanges, { initialValue: [] as number[] });
  protected readonly pickedNames = computed(() => {
    const names = new Map([...this.onSnap(), ...this.others()].map((p) => [p.playerId, p.name]));
    return this.pickedIds().map((id) => names.get(id) ?? `Player ${id}`);
  });

  constructor() {
    // The linemen on the snap are the usual audience; follow them until the coach picks by hand.
    effect(() => {
      const ids = this.onSnap().map((p) => p.playerId);
      untracked(() => {
        const control = this.form.controls.playerIds;
        if (!control.dirty) control.setValue(ids);
      });
    });
  }

  /** A new point at `ms` (the P key): the moment is set and the cursor goes to the words. */
  startAt(ms: number): void {
    this.atMs.set(Math.round(ms));
    this.endMs.set(null);
    this.problem.set(null);
    this.bodyField()?.nativeElement.focus();
  }

  protected setStart(): void {
    this.atMs.set(Math.round(this.currentMs()));
  }

  protected setEnd(): void {
    this.endMs.set(Math.round(this.currentMs()));
  }

  protected clearEnd(): void {
    this.endMs.set(null);
  }

  protected submit(): void {
    this.problem.set(null);
    if (this.form.invalid || this.spanError()) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const end = this.endMs();
    const point: PointCreate = {
      playerIds: v.playerIds,
      atMs: this.atMs(),
      ...(end !== null ? { endMs: end } : {}),
      kind: v.kind,
      ...(v.component ? { component: v.component } : {}),
      body: v.body.trim(),
    };
    this.submitting.set(true);
    this.api.createPoint(this.clipId(), point).subscribe({
      next: (comment) => {
        this.submitting.set(false);
        this.form.controls.body.reset('');
        this.endMs.set(null);
        const names = this.pickedNames();
        this.notifier.info(`Point added for ${names.length > 3 ? `${names.length} players` : names.join(', ')}.`);
        this.created.emit(comment);
      },
      error: (failure: unknown) => {
        this.submitting.set(false);
        const error = readApiError(failure);
        const unplaced = error.status === 422 ? applyServerErrors(this.form, error.fields) : [];
        this.problem.set(unplaced[0] ?? (error.status === 422 && Object.keys(error.fields).length ? null : error.message));
      },
    });
  }
}
