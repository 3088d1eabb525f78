import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { ImportOutcome } from './roster-import';

/** What became of a CSV import: the counts, or every bad row so the file can be fixed. */
@Component({
  selector: 'tw-import-report',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  template: `
    @let result = outcome();
    @switch (result.kind) {
      @case ('imported') {
        <div class="tw-alert tw-alert-info" role="status">
          <mat-icon aria-hidden="true">check_circle</mat-icon>
          <p>
            {{ result.fileName }}: {{ result.imported }} {{ result.imported === 1 ? 'player' : 'players' }} added,
            {{ result.updated }} updated.
          </p>
          <button mat-icon-button type="button" aria-label="Close this message" (click)="dismissed.emit()">
            <mat-icon aria-hidden="true">close</mat-icon>
          </button>
        </div>
      }
      @case ('failed') {
        <div class="tw-alert tw-alert-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>
          <p>{{ result.fileName }} was not imported. {{ result.message }}</p>
          <button mat-icon-button type="button" aria-label="Close this message" (click)="dismissed.emit()">
            <mat-icon aria-hidden="true">close</mat-icon>
          </button>
        </div>
      }
      @case ('rejected') {
        <section class="tw-alert tw-alert-error rejected" role="alert" aria-labelledby="import-problems">
          <mat-icon aria-hidden="true">error_outline</mat-icon>
          <div class="body">
            <h2 id="import-problems">Nothing was imported from {{ result.fileName }}</h2>
            <p>
              {{ result.rows.length }} {{ result.rows.length === 1 ? 'problem' : 'problems' }} found. Fix them in the file
              and import it again; the roster stays as it was until the whole file is right.
            </p>
            <table class="problems" data-testid="import-problems">
              <caption class="tw-visually-hidden">Problems in the file, by row</caption>
              <thead>
                <tr><th scope="col">Row</th><th scope="col">Column</th><th scope="col">Problem</th></tr>
              </thead>
              <tbody>
                @for (problem of result.rows; track $index) {
                  <tr><td>{{ problem.row }}</td><td>{{ problem.field }}</td><td>{{ problem.message }}</td></tr>
                }
              </tbody>
            </table>
            <p class="columns">Row 1 is the header; rows are counted as a spreadsheet shows them.</p>
          </div>
          <button mat-icon-button type="button" aria-label="Close this report" (click)="dismissed.emit()">
            <mat-icon aria-hidden="true">close</mat-icon>
          </button>
        </section>
      }
    }
  `,
  styles: `
    .tw-alert p {
      flex: 1 1 auto;
    }
    .body {
      flex: 1 1 auto;
      min-width: 0;
    }
    h2 {
      font: var(--mat-sys-title-medium);
      margin: 0 0 4px;
    }
    .problems {
      border-collapse: collapse;
      margin: 12px 0 8px;
      width: 100%;
      background: #fff;
      font: var(--mat-sys-body-medium);
    }
    th,
    td {
      text-align: left;
      padding: 4px 12px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .columns {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class ImportReport {
  readonly outcome = input.required<ImportOutcome>();
  readonly dismissed = output<void>();
}
