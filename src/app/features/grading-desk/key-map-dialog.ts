import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { GRADE_ACTIONS, GRADE_ACTION_LABELS, keyLabel, keyName, type GradeAction } from './grade-keys';
import { KeyMapStore } from './key-map-store';

/** The coach's own keys for the desk: add a key by pressing it, remove one, or go back to ours. */
@Component({
  selector: 'tw-key-map-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatDialogModule, MatIconModule],
  template: `
    <h2 mat-dialog-title>Your grading keys</h2>
    <mat-dialog-content (keydown)="capture($event)">
      <p class="intro">Kept in this browser. Arrows, Tab, Home/End, Enter, Esc, Space and the digits 1–9 stay as they are.</p>
      <table>
        <tbody>
          @for (action of actions; track action) {
            <tr>
              <th scope="row">{{ labels[action] }}</th>
              <td>
                @for (key of store.map()[action]; track key) {
                  <span class="key">
                    <kbd>{{ keyLabel(key) }}</kbd>
                    <button mat-icon-button type="button" [attr.aria-label]="'Remove ' + keyLabel(key) + ' from: ' + labels[action]" (click)="store.unassign(action, key)">
                      <mat-icon aria-hidden="true">close</mat-icon>
                    </button>
                  </span>
                } @empty {
                  <span class="none">no key</span>
                }
              </td>
              <td>
                @if (listening() === action) {
                  <button mat-flat-button type="button" data-testid="listening" (click)="listening.set(null)">Press a key… (Esc stops)</button>
                } @else {
                  <button mat-stroked-button type="button" (click)="listen(action)">Add key</button>
                }
              </td>
            </tr>
          }
        </tbody>
      </table>
      <p class="message" role="status" aria-live="polite">{{ message() }}</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [disabled]="store.isDefault()" (click)="reset()">Reset to our defaults</button>
      <button mat-flat-button type="button" mat-dialog-close>Done</button>
    </mat-dialog-actions>
  `,
  styles: `
    table {
      border-collapse: collapse;
      font: var(--mat-sys-body-medium);
    }
    th {
      text-align: left;
      font-weight: 400;
      padding: 4px 12px 4px 0;
    }
    td {
      padding: 2px 4px;
      white-space: nowrap;
    }
    .key {
      display: inline-flex;
      align-items: center;
    }
    kbd {
      border: 1px solid var(--mat-sys-outline);
      border-bottom-width: 2px;
      border-radius: 4px;
      padding: 0 6px;
      font-weight: 600;
    }
    .none,
    .intro {
      color: var(--mat-sys-on-surface-variant);
    }
    .message {
      min-height: 1.5em;
    }
  `,
})
export class KeyMapDialog {
  protected readonly store = inject(KeyMapStore);
  protected readonly actions = GRADE_ACTIONS;
  protected readonly labels = GRADE_ACTION_LABELS;
  protected readonly keyLabel = keyLabel;
  protected readonly listening = signal<GradeAction | null>(null);
  protected readonly message = signal('');

  protected listen(action: GradeAction): void {
    this.listening.set(action);
    this.message.set(`Press the key for: ${this.labels[action]}.`);
  }

  protected capture(event: KeyboardEvent): void {
    const action = this.listening();
    if (action === null) return;
    if (event.key === 'Escape') {
      event.preventDefault();
      event.stopPropagation();
      this.listening.set(null);
      this.message.set('No key added.');
      return;
    }
    const name = keyName(event);
    if (name === null) return;
    event.preventDefault();
    event.stopPropagation();
    const outcome = this.store.assign(action, name);
    if (!outcome.ok) {
      this.message.set(outcome.reason);
      return;
    }
    this.listening.set(null);
    this.message.set(
      outcome.movedFrom
        ? `${keyLabel(name)} now does: ${this.labels[action]}. It no longer does: ${this.labels[outcome.movedFrom]}.`
        : `${keyLabel(name)} now does: ${this.labels[action]}.`,
    );
  }

  protected reset(): void {
    this.store.reset();
    this.message.set('Back to the default keys.');
  }
}
