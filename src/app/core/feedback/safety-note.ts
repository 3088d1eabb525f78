import { ChangeDetectionStrategy, Component, input, linkedSignal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { SAFETY_POINTS, SAFETY_SUMMARY } from '@shared/safety';

let nextId = 0;

/** Plain CSS in a constant so the component spec can check the print rules (jsdom drops component styles). */
export const SAFETY_NOTE_CSS = `
  :host {
    display: block;
    margin: 4px 0 8px;
  }
  .note {
    border-left: 3px solid var(--tw-signal-amber);
    border-radius: 4px;
    background: var(--mat-sys-surface-container-low);
    color: var(--mat-sys-on-surface);
    font: var(--mat-sys-body-small);
  }
  .line {
    display: flex;
    align-items: center;
    gap: 6px;
    width: 100%;
    min-height: 32px;
    margin: 0;
    padding: 4px 8px;
    border: 0;
    background: none;
    color: inherit;
    font: inherit;
    text-align: left;
  }
  button.line {
    cursor: pointer;
  }
  button.line:focus-visible {
    outline: 2px solid var(--mat-sys-primary);
    outline-offset: -2px;
  }
  mat-icon {
    flex: none;
    width: 18px;
    height: 18px;
    font-size: 18px;
  }
  .summary {
    flex: 1;
    min-width: 0;
  }
  .points {
    margin: 0;
    padding: 0 12px 8px 40px;
  }
  .points li + li {
    margin-top: 2px;
  }
  /* Phones: a thumb-sized target and body-size text for players reading on the move. */
  @media (max-width: 599px) {
    .note {
      font: var(--mat-sys-body-medium);
    }
    .line {
      min-height: 44px;
    }
  }
  @media screen {
    .shut {
      display: none;
    }
  }
  /* On paper nothing can be clicked open: print the whole caution, without colour. */
  @media print {
    .note {
      background: none;
      border-left-color: #000;
      break-inside: avoid;
    }
    .chevron {
      display: none;
    }
  }
`;

/**
 * The safety caution beside technique coaching, restricted blocks, contact counts and practice plans.
 * Compact (the default) is one line that opens to the full caution, so dense coaching screens stay
 * readable; expanded shows everything. Printing always shows the full caution.
 */
@Component({
  selector: 'tw-safety-note',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <div class="note" role="note" aria-label="Safety">
      @if (mode() === 'compact') {
        <button type="button" class="line" [attr.aria-expanded]="open()" [attr.aria-controls]="pointsId" (click)="open.set(!open())">
          <mat-icon aria-hidden="true">info</mat-icon>
          <span class="summary"><strong>Safety:</strong> {{ summary }}</span>
          <mat-icon class="chevron" aria-hidden="true">{{ open() ? 'expand_less' : 'expand_more' }}</mat-icon>
        </button>
      } @else {
        <p class="line">
          <mat-icon aria-hidden="true">info</mat-icon>
          <span class="summary"><strong>Safety:</strong> {{ summary }}</span>
        </p>
      }
      <ul class="points" [id]="pointsId" [class.shut]="!open()" data-testid="safety-points">
        @for (point of points; track point) {
          <li>{{ point }}</li>
        }
      </ul>
    </div>
  `,
  styles: SAFETY_NOTE_CSS,
})
export class SafetyNote {
  /** 'compact': one line that opens; 'expanded': the whole caution, always open. */
  readonly mode = input<'compact' | 'expanded'>('compact');

  protected readonly open = linkedSignal(() => this.mode() === 'expanded');
  protected readonly summary = SAFETY_SUMMARY;
  protected readonly points = SAFETY_POINTS;
  protected readonly pointsId = `tw-safety-points-${nextId++}`;
}
