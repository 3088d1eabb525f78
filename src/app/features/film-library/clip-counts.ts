import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { FilmSession } from '@shared/api/film';
import { CLIP_STATES, CLIP_STATE_LABELS } from '@shared/film';
import { CLIP_STATE_ICONS } from './clip-states';

/** How many clips of a session are in each state, in words with icons; states with none are left out. */
@Component({
  selector: 'tw-clip-counts',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    @for (entry of entries(); track entry.state) {
      <span [class]="'count count-' + entry.state">
        <mat-icon aria-hidden="true">{{ entry.icon }}</mat-icon>
        {{ entry.count }} {{ entry.label }}
      </span>
    } @empty {
      <span class="none">No clips yet</span>
    }
  `,
  styles: `
    :host {
      display: inline-flex;
      flex-wrap: wrap;
      gap: 2px 10px;
      font: var(--mat-sys-body-small);
    }
    .count {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      white-space: nowrap;
    }
    mat-icon {
      font-size: 16px;
      width: 16px;
      height: 16px;
    }
    .count-ready mat-icon {
      color: var(--tw-field-green);
    }
    .count-processing mat-icon,
    .count-received mat-icon {
      color: #8a5a00;
    }
    .count-failed {
      color: #8c1d18;
      font-weight: 600;
    }
    .none {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class ClipCounts {
  readonly counts = input.required<FilmSession['clipCounts']>();

  protected readonly entries = computed(() =>
    CLIP_STATES.map((state) => ({ state, count: this.counts()[state], label: CLIP_STATE_LABELS[state].toLowerCase(), icon: CLIP_STATE_ICONS[state] })).filter(
      (entry) => entry.count > 0,
    ),
  );
}
