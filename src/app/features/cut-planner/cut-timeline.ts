import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { formatClock } from '@shared/film';
import { StripLayout, stripTileStyle } from '../snap-player/strip-tile';

const CARD_WIDTH = 128;

/**
 * The tape as a line: the cuts as markers (click to pick, drag to move), the snaps between them,
 * the playhead, and a preview card per snap start taken from the scrub strip.
 */
@Component({
  selector: 'tw-cut-timeline',
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './cut-timeline.html',
  styleUrl: './cut-timeline.scss',
})
export class CutTimeline {
  readonly durationMs = input.required<number>();
  readonly cuts = input.required<readonly number[]>();
  readonly selected = input<number | null>(null);
  readonly currentMs = input(0);
  readonly stripUrl = input<string | null>(null);
  readonly strip = input<StripLayout | null>(null);
  readonly shortIndexes = input<ReadonlySet<number>>(new Set());

  readonly selectCut = output<number>();
  readonly moveCut = output<{ index: number; ms: number }>();
  readonly seek = output<number>();

  protected readonly clock = formatClock;
  private readonly drag = signal<{ index: number; ms: number; track: DOMRect; moved: boolean } | null>(null);

  /** The cuts as drawn: a dragged marker follows the pointer until it is let go. */
  protected readonly shown = computed(() => {
    const drag = this.drag();
    return this.cuts().map((cut, i) => (drag && drag.index === i ? drag.ms : cut));
  });

  protected readonly segments = computed(() => {
    const duration = this.durationMs();
    const bounds = [0, ...this.shown(), duration];
    return bounds.slice(1).map((end, i) => ({ start: bounds[i], end, left: this.pct(bounds[i]), width: this.pct(end - bounds[i]) }));
  });

  protected readonly cards = computed(() => {
    const url = this.stripUrl();
    const strip = this.strip();
    return [0, ...this.shown()].map((start, i) => ({
      start,
      snap: i + 1,
      cutIndex: i - 1,
      tile: url && strip ? stripTileStyle(url, strip, start, CARD_WIDTH) : null,
    }));
  });

  protected pct(ms: number): number {
    const duration = this.durationMs();
    return duration > 0 ? Math.min(100, Math.max(0, (ms / duration) * 100)) : 0;
  }

  protected onTrackClick(event: MouseEvent): void {
    const box = (event.currentTarget as HTMLElement).getBoundingClientRect();
    if (box.width <= 0) return;
    this.seek.emit(((event.clientX - box.left) / box.width) * this.durationMs());
  }

  protected startDrag(index: number, event: PointerEvent): void {
    if (event.button !== 0) return;
    const marker = event.currentTarget as HTMLElement;
    const track = marker.parentElement?.getBoundingClientRect();
    if (!track || track.width <= 0) return;
    marker.setPointerCapture?.(event.pointerId);
    this.drag.set({ index, ms: this.cuts()[index], track, moved: false });
    this.selectCut.emit(index);
  }

  protected dragMove(event: PointerEvent): void {
    const drag = this.drag();
    if (!drag) return;
    const ratio = (event.clientX - drag.track.left) / drag.track.width;
    this.drag.set({ ...drag, ms: Math.min(1, Math.max(0, ratio)) * this.durationMs(), moved: true });
  }

  protected endDrag(): void {
    const drag = this.drag();
    this.drag.set(null);
    if (drag?.moved) this.moveCut.emit({ index: drag.index, ms: drag.ms });
  }
}
