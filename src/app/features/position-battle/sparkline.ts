import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { formatRate } from '../progress/rate-text';

const W = 160;
const H = 40;
const PAD = 4;

/** A session-by-session plus rate line with the winning grade; the sentence beside it says the same in words. */
@Component({
  selector: 'tw-sparkline',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (points().length > 1) {
      <svg [attr.viewBox]="'0 0 ' + w + ' ' + h" aria-hidden="true">
        @if (threshold() !== null) {
          <line class="line" x1="0" [attr.x2]="w" [attr.y1]="y(threshold()!)" [attr.y2]="y(threshold()!)" />
        }
        <polyline class="trend" [attr.points]="path()" />
        <circle class="last" [attr.cx]="points()[points().length - 1].x" [attr.cy]="points()[points().length - 1].y" r="2.5" />
      </svg>
    }
    <span class="words">{{ words() }}</span>
  `,
  styles: `
    :host {
      display: flex;
      align-items: center;
      gap: 8px;
      flex-wrap: wrap;
    }
    svg {
      width: 160px;
      height: 40px;
    }
    .trend {
      fill: none;
      stroke: #2e6b4f;
      stroke-width: 2;
    }
    .line {
      stroke: #1f2a36;
      stroke-dasharray: 3 2;
    }
    .last {
      fill: #1f2a36;
    }
    .words {
      font: var(--mat-sys-body-small);
    }
  `,
})
export class Sparkline {
  readonly values = input.required<readonly { date: string; rate: number | null }[]>();
  readonly threshold = input<number | null>(null);
  protected readonly w = W;
  protected readonly h = H;

  private readonly graded = computed(() => this.values().filter((v): v is { date: string; rate: number } => v.rate !== null));
  protected readonly points = computed(() => {
    const list = this.graded();
    const step = list.length > 1 ? (W - 2 * PAD) / (list.length - 1) : 0;
    return list.map((v, i) => ({ x: PAD + i * step, y: this.y(v.rate) }));
  });
  protected readonly path = computed(() => this.points().map((p) => `${p.x.toFixed(1)},${p.y.toFixed(1)}`).join(' '));
  protected readonly words = computed(() => {
    const list = this.graded();
    if (list.length === 0) return 'no graded sessions';
    if (list.length === 1) return `one graded session: ${formatRate(list[0].rate)}`;
    return `${formatRate(list[0].rate)} first session, ${formatRate(list[list.length - 1].rate)} latest, over ${list.length} sessions`;
  });

  protected y(rate: number): number {
    return H - PAD - rate * (H - 2 * PAD);
  }
}
