import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { namesRestrictedBlock } from '@shared/safety';
import { SafetyNote } from '../../core/feedback/safety-note';
import type { GradeDraft } from './grade-draft';
import type { CountField } from './grade-columns';
import { MAX_COUNT } from './grade-edits';

export interface RowDetailsData {
  title: string;
  snapOrder: number | null;
  draft: GradeDraft;
  missedReasons: readonly string[];
  penaltyTypes: readonly string[];
  readOnly: boolean;
}

/** The note, the missed reason, penalties and counts of one row, for typing and for the mouse. */
@Component({
  selector: 'tw-row-details-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, SafetyNote],
  template: `
    <h2 mat-dialog-title>{{ data.title }}{{ data.snapOrder !== null ? ' · snap ' + data.snapOrder : '' }}</h2>
    <mat-dialog-content class="tw-form tw-dense" (keydown)="onKey($event)">
      @let d = draft();
      <mat-form-field>
        <mat-label>Note (coaching point)</mat-label>
        <textarea matInput rows="3" maxlength="2000" [value]="d.note ?? ''" [readonly]="data.readOnly" (input)="setNote($event)"></textarea>
        <mat-hint>Ctrl+Enter saves</mat-hint>
      </mat-form-field>

      <mat-form-field>
        <mat-label>Missed assignment: reason</mat-label>
        <mat-select [value]="d.missedReason" [disabled]="data.readOnly" (valueChange)="setReason($event)">
          <mat-option [value]="null">{{ d.assignment === 'missed' ? 'No reason yet' : 'Not missed' }}</mat-option>
          @for (reason of data.missedReasons; track reason) {
            <mat-option [value]="reason">{{ reason }}</mat-option>
          }
        </mat-select>
        <mat-hint>Picking a reason marks the assignment missed.</mat-hint>
      </mat-form-field>

      <div class="counts">
        @for (c of counts; track c.field) {
          <mat-form-field>
            <mat-label>{{ c.label }}</mat-label>
            <input matInput type="number" min="0" [max]="max" [value]="d[c.field]" [readonly]="data.readOnly" (input)="setCount(c.field, $event)" />
          </mat-form-field>
        }
      </div>

      <fieldset>
        <legend>Penalties ({{ d.penalties.length }})</legend>
        @if (restrictedBlocks) {
          <tw-safety-note />
        }
        <ul>
          @for (p of d.penalties; track $index; let i = $index) {
            <li>
              {{ p.type }}
              @if (!data.readOnly) {
                <button mat-button type="button" [attr.aria-label]="'Remove penalty ' + (i + 1) + ', ' + p.type" (click)="removePenalty(i)">Remove</button>
              }
            </li>
          } @empty {
            <li>None</li>
          }
        </ul>
        @if (!data.readOnly && d.penalties.length < 10) {
          <mat-form-field>
            <mat-label>Add a penalty</mat-label>
            <mat-select [value]="null" (valueChange)="addPenalty($event)">
              @for (type of data.penaltyTypes; track type) {
                <mat-option [value]="type">{{ type }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
        }
      </fieldset>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      @if (data.readOnly) {
        <button mat-flat-button type="button" mat-dialog-close>Close</button>
      } @else {
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="button" (click)="save()">Save</button>
      }
    </mat-dialog-actions>
  `,
  styles: `
    .counts {
      display: grid;
      grid-template-columns: repeat(3, 1fr);
      gap: 8px;
    }
    fieldset {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
      margin: 8px 0 0;
    }
    ul {
      margin: 0 0 8px;
      padding-left: 20px;
    }
  `,
})
export class RowDetailsDialog {
  protected readonly data = inject<RowDetailsData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<RowDetailsDialog, GradeDraft>>(MatDialogRef);
  protected readonly draft = signal<GradeDraft>(this.data.draft);
  protected readonly max = MAX_COUNT;
  /** Light touch: the caution only where the list names blocks whose legality depends on the rule book. */
  protected readonly restrictedBlocks = namesRestrictedBlock(this.data.penaltyTypes);
  protected readonly counts: { field: CountField; label: string }[] = [
    { field: 'knockdowns', label: 'Knockdowns' },
    { field: 'pressuresAllowed', label: 'Pressures allowed' },
    { field: 'sacksAllowed', label: 'Sacks allowed' },
  ];

  protected setNote(event: Event): void {
    const text = (event.target as HTMLTextAreaElement).value;
    this.draft.update((d) => ({ ...d, note: text.trim() === '' ? null : text }));
  }

  protected setReason(reason: string | null): void {
    this.draft.update((d) => (reason === null ? { ...d, missedReason: null } : { ...d, assignment: 'missed', missedReason: reason }));
  }

  protected setCount(field: CountField, event: Event): void {
    const value = Math.round(Number((event.target as HTMLInputElement).value));
    this.draft.update((d) => ({ ...d, [field]: Number.isFinite(value) ? Math.min(MAX_COUNT, Math.max(0, value)) : 0 }));
  }

  protected addPenalty(type: string | null): void {
    if (type) this.draft.update((d) => ({ ...d, penalties: [...d.penalties, { type }] }));
  }

  protected removePenalty(index: number): void {
    this.draft.update((d) => ({ ...d, penalties: d.penalties.filter((_, i) => i !== index) }));
  }

  protected onKey(event: KeyboardEvent): void {
    if (event.key === 'Enter' && (event.ctrlKey || event.metaKey) && !this.data.readOnly) {
      event.preventDefault();
      this.save();
    }
  }

  protected save(): void {
    this.ref.close(this.draft());
  }
}
