import { CdkDrag, CdkDragDrop, CdkDragHandle, CdkDropList } from '@angular/cdk/drag-drop';
import { ChangeDetectionStrategy, Component, model, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { ReelItem, clipLabel, moveItem } from './reel-item';

/**
 * The clips of a cut-up in playing order: drag to reorder (or the up and down buttons, for the
 * keyboard), a note for each clip, remove.
 */
@Component({
  selector: 'tw-cutup-reel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [CdkDrag, CdkDragHandle, CdkDropList, MatButtonModule, MatIconModule],
  template: `
    @if (items().length === 0) {
      <p class="empty" role="status">No clips yet. Add them from the search.</p>
    } @else {
      <ol class="reel" cdkDropList (cdkDropListDropped)="dropped($event)" aria-label="Clips in playing order">
        @for (item of items(); track item.clipId; let i = $index, first = $first, last = $last) {
          <li cdkDrag class="item" data-testid="reel-item">
            <span class="handle" cdkDragHandle aria-hidden="true"><mat-icon>drag_indicator</mat-icon></span>
            <span class="place">{{ i + 1 }}</span>
            @if (item.posterUrl) {
              <img [src]="item.posterUrl" alt="" loading="lazy" />
            }
            <div class="text">
              <span class="name">{{ label(item) }}</span>
              <label class="note">
                <span class="tw-visually-hidden">Note for clip {{ i + 1 }}</span>
                <input
                  type="text"
                  maxlength="500"
                  placeholder="Note for this clip (optional)"
                  [value]="item.note"
                  (input)="setNote(i, $any($event.target).value)"
                />
              </label>
            </div>
            <div class="moves">
              <button mat-icon-button type="button" [disabled]="first" [attr.aria-label]="'Move clip ' + (i + 1) + ' up'" (click)="move(i, -1)">
                <mat-icon aria-hidden="true">arrow_upward</mat-icon>
              </button>
              <button mat-icon-button type="button" [disabled]="last" [attr.aria-label]="'Move clip ' + (i + 1) + ' down'" (click)="move(i, 1)">
                <mat-icon aria-hidden="true">arrow_downward</mat-icon>
              </button>
              <button mat-icon-button type="button" [attr.aria-label]="'Take clip ' + (i + 1) + ' out'" (click)="remove(i)">
                <mat-icon aria-hidden="true">close</mat-icon>
              </button>
            </div>
          </li>
        }
      </ol>
    }
    <div class="tw-visually-hidden" aria-live="polite">{{ announcement() }}</div>
  `,
  styles: `
    :host {
      display: block;
    }
    .empty {
      padding: 16px;
      border: 1px dashed var(--mat-sys-outline-variant);
      border-radius: 8px;
      color: var(--mat-sys-on-surface-variant);
      text-align: center;
    }
    .reel {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    .item {
      display: flex;
      align-items: center;
      gap: 8px;
      padding: 6px 4px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      background: var(--mat-sys-surface-container-lowest);
    }
    .handle {
      cursor: grab;
      color: var(--mat-sys-on-surface-variant);
      display: inline-flex;
    }
    .place {
      min-width: 2ch;
      font: 600 14px/20px 'Open Sans', system-ui, sans-serif;
      font-variant-numeric: tabular-nums;
      text-align: right;
    }
    img {
      width: 64px;
      aspect-ratio: 16 / 9;
      object-fit: cover;
      border-radius: 4px;
      background: var(--tw-slate-ink);
    }
    .text {
      flex: 1 1 auto;
      min-width: 0;
      display: flex;
      flex-direction: column;
      gap: 4px;
    }
    .name {
      font: var(--mat-sys-body-medium);
    }
    .note input {
      width: 100%;
      box-sizing: border-box;
      padding: 4px 8px;
      border: 1px solid var(--mat-sys-outline);
      border-radius: 4px;
      font: var(--mat-sys-body-medium);
      background: #fff;
    }
    .moves {
      display: flex;
    }
    .cdk-drag-preview {
      box-shadow: 0 4px 12px rgb(0 0 0 / 25%);
    }
    .cdk-drag-placeholder {
      opacity: 0.4;
    }
  `,
})
export class CutupReel {
  readonly items = model.required<ReelItem[]>();
  protected readonly label = clipLabel;
  protected readonly announcement = signal('');

  protected dropped(event: CdkDragDrop<unknown>): void {
    if (event.previousIndex === event.currentIndex) return;
    this.items.update((list) => moveItem(list, event.previousIndex, event.currentIndex));
    this.announcement.set(`Clip moved to place ${event.currentIndex + 1}.`);
  }

  protected move(index: number, delta: number): void {
    this.items.update((list) => moveItem(list, index, index + delta));
    this.announcement.set(`Clip moved to place ${index + delta + 1}.`);
  }

  protected remove(index: number): void {
    this.items.update((list) => list.filter((_, i) => i !== index));
    this.announcement.set('Clip taken out.');
  }

  protected setNote(index: number, note: string): void {
    this.items.update((list) => list.map((item, i) => (i === index ? { ...item, note } : item)));
  }
}
