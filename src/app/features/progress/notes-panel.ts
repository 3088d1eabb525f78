import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { readApiError } from '../../core/http/api-error';
import type { CoachNote } from './development-types';
import { ProgressApi } from './progress-api';

/** Coach notes on a player's development, newest first; coaches add them. */
@Component({
  selector: 'tw-notes-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  template: `
    @if (canEdit()) {
      <form class="add no-print" (submit)="$event.preventDefault(); add()" aria-label="New coach note">
        <mat-form-field class="body">
          <mat-label>New note</mat-label>
          <textarea matInput rows="2" maxlength="2000" [formControl]="body"></textarea>
        </mat-form-field>
        <button mat-flat-button type="submit" [disabled]="busy() || body.invalid">Add note</button>
      </form>
      @if (problem(); as p) {
        <div class="tw-alert tw-alert-error" role="alert"><mat-icon aria-hidden="true">error_outline</mat-icon><p>{{ p }}</p></div>
      }
    }
    @if (notes().length === 0) {
      <p class="tw-hint">No coach notes yet.</p>
    } @else {
      <ol class="notes">
        @for (n of notes(); track n.id) {
          <li>
            <p class="body-text">{{ n.body }}</p>
            <p class="tw-hint">{{ n.author }} · {{ n.createdAt | date: 'EEE d MMM y, HH:mm' }}</p>
          </li>
        }
      </ol>
    }
  `,
  styles: `
    .add {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      flex-wrap: wrap;
    }
    .body {
      flex: 1 1 320px;
    }
    .notes {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    li {
      border-left: 3px solid var(--mat-sys-outline-variant);
      padding: 4px 12px;
      margin-bottom: 8px;
    }
    .body-text {
      margin: 0 0 2px;
      white-space: pre-wrap;
    }
  `,
})
export class NotesPanel {
  readonly playerId = input.required<number>();
  readonly notes = input.required<readonly { id: number; body: string; author: string; createdAt: string }[]>();
  readonly canEdit = input(false);
  readonly changed = output<void>();

  private readonly api = inject(ProgressApi);
  protected readonly body = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(2000), Validators.pattern(/\S/)] });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected add(): void {
    const text = this.body.value.trim();
    if (!text) return;
    this.busy.set(true);
    this.problem.set(null);
    this.api.addNote(this.playerId(), text).subscribe({
      next: () => {
        this.busy.set(false);
        this.body.reset();
        this.changed.emit();
      },
      error: (failure: unknown) => {
        this.busy.set(false);
        this.problem.set(readApiError(failure).message);
      },
    });
  }
}
