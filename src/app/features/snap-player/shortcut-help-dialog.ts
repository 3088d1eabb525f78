import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import type { ShortcutGroup } from './shortcut-keys';
import { ShortcutList } from './shortcut-list';

export interface ShortcutHelpData {
  title: string;
  groups: readonly ShortcutGroup[];
  note?: string;
}

/** The "?" dialog: every shortcut of the page, grouped. */
@Component({
  selector: 'tw-shortcut-help-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatDialogModule, ShortcutList],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content>
      @if (data.note) {
        <p class="note">{{ data.note }}</p>
      }
      <tw-shortcut-list [groups]="data.groups" />
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-flat-button type="button" mat-dialog-close>Close</button>
    </mat-dialog-actions>
  `,
  styles: `
    .note {
      margin: 0 0 8px;
      font: var(--mat-sys-body-medium);
    }
    tw-shortcut-list {
      font: var(--mat-sys-body-medium);
    }
  `,
})
export class ShortcutHelpDialog {
  protected readonly data = inject<ShortcutHelpData>(MAT_DIALOG_DATA);
}
