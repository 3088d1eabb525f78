import { ChangeDetectionStrategy, Component, ElementRef, inject, input, output, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { RosterImportRowError } from '@shared/api/roster';
import { readApiError } from '../../core/http/api-error';
import { readFileText } from './read-file-text';
import { RosterApi } from './roster-api';

export type ImportOutcome =
  | { kind: 'imported'; fileName: string; imported: number; updated: number }
  | { kind: 'rejected'; fileName: string; message: string; rows: RosterImportRowError[] }
  | { kind: 'failed'; fileName: string; message: string };

// The API refuses bodies over 1 MB; say so before uploading.
const MAX_BYTES = 1_000_000;

/** The "Import CSV" button: picks a file, reads it, posts it, reports what happened. */
@Component({
  selector: 'tw-roster-import',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  template: `
    <input
      #picker
      class="tw-visually-hidden"
      type="file"
      accept=".csv,text/csv"
      tabindex="-1"
      aria-hidden="true"
      data-testid="roster-file"
      (change)="picked()"
    />
    <button mat-stroked-button type="button" [disabled]="busy()" (click)="picker.click()">
      <mat-icon aria-hidden="true">upload_file</mat-icon>
      {{ busy() ? 'Importing…' : 'Import CSV' }}
    </button>
  `,
})
export class RosterImport {
  readonly teamId = input.required<number>();
  readonly seasonId = input.required<number | null>();
  readonly finished = output<ImportOutcome>();

  private readonly api = inject(RosterApi);
  private readonly picker = viewChild.required<ElementRef<HTMLInputElement>>('picker');
  protected readonly busy = signal(false);

  protected async picked(): Promise<void> {
    const input = this.picker().nativeElement;
    const file = input.files?.[0];
    input.value = ''; // Picking the same file again after fixing it must fire `change` again.
    if (!file) return;
    if (file.size > MAX_BYTES) {
      this.finished.emit({ kind: 'failed', fileName: file.name, message: 'The file is larger than 1 MB. Split it and import the parts.' });
      return;
    }
    this.busy.set(true);
    let csv: string;
    try {
      csv = await readFileText(file);
    } catch {
      this.busy.set(false);
      this.finished.emit({ kind: 'failed', fileName: file.name, message: 'The file could not be read.' });
      return;
    }
    this.api.import(this.teamId(), csv, this.seasonId()).subscribe({
      next: (counts) => {
        this.busy.set(false);
        this.finished.emit({ kind: 'imported', fileName: file.name, ...counts });
      },
      error: (failure: unknown) => {
        this.busy.set(false);
        const error = readApiError(failure);
        this.finished.emit(
          error.rows.length > 0
            ? { kind: 'rejected', fileName: file.name, message: error.message, rows: error.rows }
            : { kind: 'failed', fileName: file.name, message: error.fields['csv'] ?? error.message },
        );
      },
    });
  }
}
