import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { Interval } from '@shared/stats';
import { formatInterval, formatRate, snapsText } from '../progress/rate-text';

export interface IntervalRow {
  label: string;
  rate: number | null;
  interval: Interval | null;
  snaps: number;
}

const LEFT = 150;
const RIGHT = 16;
const ROW = 34;
const TOP = 10;
const AXIS = 26;

/**
 * A dot-and-interval plot: each player's plus rate as a dot, his 95 % interval as a bar through it,
 * on one 0–100 % axis with the winning-grade line. Plain SVG with a viewBox, so it scales on screen
 * and prints crisp; overlapping bars say "cannot tell apart yet" at a glance.
 */
@Component({
  selector: 'tw-interval-plot',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg [attr.viewBox]="'0 0 ' + width + ' ' + height()" role="img" [attr.aria-label]="summary()" preserveAspectRatio="xMinYMin meet">
      @for (t of ticks; track t) {
        <line class="grid" [attr.x1]="x(t)" [attr.x2]="x(t)" [attr.y1]="top" [attr.y2]="height() - axis" />
        <text class="tick" [attr.x]="x(t)" [attr.y]="height() - 8" text-anchor="middle">{{ t * 100 }} %</text>
      }
      @if (threshold() !== null) {
        <line class="line" [attr.x1]="x(threshold()!)" [attr.x2]="x(threshold()!)" [attr.y1]="top - 4" [attr.y2]="height() - axis" />
        <text class="line-label" [attr.x]="x(threshold()!) + 4" [attr.y]="top + 2">winning grade</text>
      }
      @for (r of rows(); track r.label; let i = $index) {
        <text class="label" [attr.x]="left - 8" [attr.y]="y(i) + 4" text-anchor="end">{{ r.label }}</text>
        @if (r.interval) {
          <line class="bar" [attr.x1]="x(r.interval[0])" [attr.x2]="x(r.interval[1])" [attr.y1]="y(i)" [attr.y2]="y(i)" />
          <line class="cap" [attr.x1]="x(r.interval[0])" [attr.x2]="x(r.interval[0])" [attr.y1]="y(i) - 6" [attr.y2]="y(i) + 6" />
          <line class="cap" [attr.x1]="x(r.interval[1])" [attr.x2]="x(r.interval[1])" [attr.y1]="y(i) - 6" [attr.y2]="y(i) + 6" />
        }
        @if (r.rate !== null) {
          <circle class="dot" [attr.cx]="x(r.rate)" [attr.cy]="y(i)" r="5" />
        } @else {
          <text class="none" [attr.x]="left + 4" [attr.y]="y(i) + 4">no graded snaps</text>
        }
      }
    </svg>
  `,
  styles: `
    svg {
      width: 100%;
      max-width: 720px;
      height: auto;
      font-family: inherit;
    }
    .grid {
      stroke: #d9d6cf;
    }
    .tick,
    .line-label {
      font-size: 11px;
      fill: #444;
    }
    .label {
      font-size: 13px;
      fill: #1f2a36;
    }
    .line {
      stroke: #1f2a36;
      stroke-width: 1.5;
      stroke-dasharray: 5 3;
    }
    .bar,
    .cap {
      stroke: #2e6b4f;
      stroke-width: 3;
    }
    .dot {
      fill: #1f2a36;
    }
    .none {
      font-size: 12px;
      fill: #444;
      font-style: italic;
    }
  `,
})
export class IntervalPlot {
  readonly rows = input.required<readonly IntervalRow[]>();
  readonly threshold = input<number | null>(null);

  protected readonly width = 640;
  protected readonly left = LEFT;
  protected readonly top = TOP + 10;
  protected readonly axis = AXIS;
  protected readonly ticks = [0, 0.2, 0.4, 0.6, 0.8, 1];
  protected readonly height = computed(() => this.top + this.rows().length * ROW + AXIS);
  protected readonly summary = computed(
    () =>
      'Plus rate with 95 % interval: ' +
      this.rows()
        .map((r) => `${r.label} ${formatRate(r.rate)} of ${snapsText(r.snaps)}, interval ${formatInterval(r.interval)}`)
        .join('; '),
  );

  protected x(rate: number): number {
    return LEFT + rate * (this.width - LEFT - RIGHT);
  }

  protected y(index: number): number {
    return this.top + index * ROW + ROW / 2;
  }
}
