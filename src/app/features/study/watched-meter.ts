import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { WATCHED_FROM, watchedWords } from './clip-groups';

/** How much of a clip he has watched: the words say it, the bar shows it. */
@Component({
  selector: 'tw-watched-meter',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <span class="bar" aria-hidden="true"><span class="fill" [class.done]="done()" [style.width.%]="percent()"></span></span>
    <span class="words">{{ words() }}</span>
  `,
  styles: `
    :host {
      display: flex;
      align-items: center;
      gap: 8px;
      font: var(--mat-sys-body-medium);
    }
    .bar {
      flex: 1 1 auto;
      max-width: 140px;
      height: 8px;
      border-radius: 4px;
      background: var(--mat-sys-surface-container-highest);
      border: 1px solid var(--mat-sys-outline-variant);
      overflow: hidden;
    }
    .fill {
      display: block;
      height: 100%;
      background: var(--tw-signal-amber);
      &.done {
        background: var(--tw-field-green);
      }
    }
    .words {
      white-space: nowrap;
    }
  `,
})
export class WatchedMeter {
  readonly fraction = input.required<number>();
  protected readonly percent = computed(() => Math.round(Math.min(1, Math.max(0, this.fraction())) * 100));
  protected readonly done = computed(() => this.fraction() >= WATCHED_FROM);
  protected readonly words = computed(() => watchedWords(this.fraction()));
}
