import { ChangeDetectionStrategy, Component, input, model } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** The "Show numbers" button under every chart: the table it opens holds what the chart draws. */
@Component({
  selector: 'tw-numbers-toggle',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  template: `
    <button mat-stroked-button type="button" class="no-print" [attr.aria-expanded]="open()" [attr.aria-controls]="controls()" (click)="open.set(!open())">
      <mat-icon aria-hidden="true">{{ open() ? 'visibility_off' : 'table_rows' }}</mat-icon>
      {{ open() ? 'Hide numbers' : 'Show numbers' }}
    </button>
  `,
})
export class NumbersToggle {
  readonly open = model(false);
  /** The id of the table it shows. */
  readonly controls = input.required<string>();
}
