import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { kindIcon, kindLabel, momentLabel } from './point-labels';

export interface PointMarker {
  id: number;
  atMs: number;
  endMs: number | null;
  kind: string;
  /** A few words of the point, read out with the marker. */
  text: string;
}

/**
 * The coaching points of a clip as marks along the video's length: a button at each moment and a
 * band over each span. Placed under the player, with the seek bar's insets so a mark sits below
 * the same moment of the bar.
 */
@Component({
  selector: 'tw-point-markers',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    @if (placed().length > 0) {
      <div class="track" role="group" aria-label="Coaching points along the clip">
        <div class="rail" aria-hidden="true"></div>
        @for (m of placed(); track m.id) {
          @if (m.width > 0) {
            <span class="band" [class.active]="m.id === activeId()" [style.left.%]="m.left" [style.width.%]="m.width" aria-hidden="true"></span>
          }
          <button
            type="button"
            class="marker"
            [class.active]="m.id === activeId()"
            [style.left.%]="m.left"
            [attr.aria-label]="'Play from ' + m.moment + ', ' + m.kindText + ': ' + m.text"
            [attr.aria-current]="m.id === activeId() ? 'true' : null"
            [attr.data-marker]="m.id"
            (click)="picked.emit(m.id)"
          >
            <mat-icon aria-hidden="true">{{ m.icon }}</mat-icon>
          </button>
        }
      </div>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .track {
      position: relative;
      height: 40px;
      margin: 0 12px;
    }
    .rail {
      position: absolute;
      left: 0;
      right: 0;
      top: 19px;
      height: 2px;
      background: rgb(245 243 238 / 35%);
    }
    .band {
      position: absolute;
      top: 14px;
      height: 12px;
      border-radius: 3px;
      background: rgb(217 154 30 / 40%);
      border: 1px solid var(--tw-signal-amber);
      box-sizing: border-box;
      &.active {
        background: rgb(217 154 30 / 75%);
      }
    }
    .marker {
      position: absolute;
      top: 4px;
      width: 32px;
      height: 32px;
      margin-left: -16px;
      padding: 0;
      display: inline-flex;
      align-items: center;
      justify-content: center;
      border-radius: 50%;
      border: 2px solid var(--tw-chalk);
      background: var(--tw-slate-ink);
      color: var(--tw-chalk);
      cursor: pointer;
      mat-icon {
        font-size: 18px;
        width: 18px;
        height: 18px;
      }
      &.active {
        background: var(--tw-signal-amber);
        color: var(--tw-slate-ink);
        border-color: var(--tw-signal-amber);
      }
      &:focus-visible {
        outline: 3px solid var(--tw-signal-amber);
        outline-offset: 1px;
      }
    }
  `,
})
export class PointMarkers {
  readonly markers = input<readonly PointMarker[]>([]);
  readonly durationMs = input<number>(0);
  readonly activeId = input<number | null>(null);
  readonly picked = output<number>();

  protected readonly placed = computed(() => {
    const duration = this.durationMs();
    if (!(duration > 0)) return [];
    const pct = (ms: number) => (Math.min(Math.max(ms, 0), duration) / duration) * 100;
    return this.markers().map((m) => {
      const left = pct(m.atMs);
      const end = m.endMs !== null && m.endMs > m.atMs ? pct(m.endMs) : left;
      return {
        id: m.id,
        left,
        width: end - left,
        icon: kindIcon(m.kind),
        kindText: kindLabel(m.kind),
        moment: momentLabel(m.atMs, m.endMs),
        text: m.text.length > 80 ? `${m.text.slice(0, 77)}…` : m.text,
      };
    });
  });
}
