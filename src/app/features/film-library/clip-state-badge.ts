import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { CLIP_STATE_LABELS, type ClipState } from '@shared/film';
import { CLIP_STATE_ICONS } from './clip-states';

/** A clip's state as icon + word (+ progress while processing, + the reason when failed). */
@Component({
  selector: 'tw-clip-state',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <span [class]="'state state-' + state()">
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
      <span>{{ text() }}</span>
    </span>
    @if (state() === 'failed' && reason()) {
      <span class="reason">{{ reason() }}</span>
    }
  `,
  styles: `
    :host {
      display: inline-flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 4px 8px;
      font: var(--mat-sys-body-small);
    }
    .state {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      padding: 0 6px 0 2px;
      border-radius: 10px;
      font-weight: 600;
      white-space: nowrap;
    }
    mat-icon {
      font-size: 16px;
      width: 16px;
      height: 16px;
    }
    .state-ready {
      background: var(--tw-ok-soft);
      color: #164430;
    }
    .state-processing,
    .state-received {
      background: var(--tw-amber-soft);
      color: var(--tw-slate-ink);
    }
    .state-failed {
      background: var(--tw-danger-soft);
      color: #5c0b06;
    }
    .reason {
      color: #5c0b06;
    }
  `,
})
export class ClipStateBadge {
  readonly state = input.required<ClipState>();
  readonly progress = input<number | null>(null);
  readonly reason = input<string | null>(null);

  protected readonly icon = computed(() => CLIP_STATE_ICONS[this.state()]);
  protected readonly text = computed(() => {
    const progress = this.progress();
    const label = CLIP_STATE_LABELS[this.state()];
    return this.state() === 'processing' && progress !== null ? `${label} ${Math.round(progress)}%` : label;
  });
}
