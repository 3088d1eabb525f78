import { ChangeDetectionStrategy, Component, ElementRef, inject, input, output, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { readApiError } from '../../core/http/api-error';
import { readFileText } from '../roster/read-file-text';
import { FilmApi } from './film-api';

type Outcome =
  | { kind: 'imported'; fileName: string; updated: number }
  | { kind: 'rejected'; fileName: string; message: string; rows: { row: number; field: string; message: string }[] }
  | { kind: 'failed'; fileName: string; message: string };

// The API takes at most 2 MB of JSON; say so before sending.
const MAX_BYTES = 1_900_000;

/** "Import tags": play data for existing snaps from CSV, all or nothing; bad rows are listed. */
@Component({
  selector: 'tw-snap-tags-import',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  template: `
    <input #picker class="tw-visually-hidden" type="file" accept=".csv,text/csv" tabindex="-1" aria-hidden="true" data-testid="tags-file" (change)="picked()" />
    <button mat-stroked-button type="button" [disabled]="busy()" (click)="picker.click()">
      <mat-icon aria-hidden="true">upload_file</mat-icon> {{ busy() ? 'Importing…' : 'Import tags (CSV)' }}
    </button>
    @if (outcome(); as result) {
      <div class="report" [class]="result.kind === 'imported' ? 'tw-alert tw-alert-info' : 'tw-alert tw-alert-error'" role="status">
        <mat-icon aria-hidden="true">{{ result.kind === 'imported' ? 'check_circle' : 'error_outline' }}</mat-icon>
        <div class="body">
          @switch (result.kind) {
            @case ('imported') {
              <p>{{ result.fileName }}: play data of {{ result.updated }} {{ result.updated === 1 ? 'snap' : 'snaps' }} updated.</p>
            }
            @case ('failed') {
              <p>{{ result.fileName }} was not imported. {{ result.message }}</p>
            }
            @case ('rejected') {
              <p><strong>Nothing was imported from {{ result.fileName }}.</strong> {{ result.message }} Fix these rows and import the file again:</p>
              <table data-testid="tags-import-problems">
                <thead>
                  <tr><th scope="col">Row</th><th scope="col">Column</th><th scope="col">Problem</th></tr>
                </thead>
                <tbody>
                  @for (problem of result.rows; track $index) {
                    <tr><td>{{ problem.row }}</td><td>{{ problem.field }}</td><td>{{ problem.message }}</td></tr>
                  }
                </tbody>
              </table>
            }
          }
        </div>
        <button mat-icon-button type="button" aria-label="Close this message" (click)="outcome.set(null)">
          <mat-icon aria-hidden="true">close</mat-icon>
        </button>
      </div>
    }
  `,
  styles: `
    :host {
      display: contents;
    }
    .report {
      flex-basis: 100%;
    }
    .body {
      flex: 1 1 auto;
    }
    table {
      border-collapse: collapse;
      margin-top: 8px;
      background: #fff;
    }
    th,
    td {
      text-align: left;
      padding: 2px 10px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
  `,
})
export class SnapTagsImport {
  readonly sessionId = input.required<number>();
  readonly imported = output<void>();

  private readonly api = inject(FilmApi);
  private readonly picker = viewChild.required<ElementRef<HTMLInputElement>>('picker');
  protected readonly busy = signal(false);
  protected readonly outcome = signal<Outcome | null>(null);

  protected async picked(): Promise<void> {
    const input = this.picker().nativeElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    if (file.size > MAX_BYTES) {
      this.outcome.set({ kind: 'failed', fileName: file.name, message: 'The file is larger than 1.9 MB.' });
      return;
    }
    this.busy.set(true);
    let csv: string;
    try {
      csv = await readFileText(file);
    } catch {
      this.busy.set(false);
      this.outcome.set({ kind: 'failed', fileName: file.name, message: 'The file could not be read.' });
      return;
    }
    this.api.importSnapTags(this.sessionId(), csv).subscribe({
      next: ({ updated }) => {
        this.busy.set(false);
        this.outcome.set({ kind: 'imported', fileName: file.name, updated });
        this.imported.emit();
      },
      error: (failure: unknown) => {
        this.busy.set(false);
        const error = readApiError(failure);
        this.outcome.set(
          error.rows.length > 0
            ? { kind: 'rejected', fileName: file.name, message: error.message, rows: error.rows }
            : { kind: 'failed', fileName: file.name, message: error.fields['csv'] ?? error.message },
        );
      },
    });
  }
}
