import { ChangeDetectionStrategy, Component, ElementRef, afterRenderEffect, computed, inject, input, output } from '@angular/core';
import type { Clip, Snap } from '@shared/api/film';
import { ANGLE_LABELS } from '@shared/film';
import { ClipStateBadge } from './clip-state-badge';
import { PickMode, SnapSelection } from './snap-selection';
import { snapSummary } from './snap-summary';

/** A clip as the snap list shows it; progress and reason arrive with the polled clip list. */
export type SnapClipView = Pick<Clip, 'id' | 'angle' | 'status' | 'posterUrl'> & Partial<Pick<Clip, 'progress' | 'failureReason'>>;

/** The snaps of a session in order: poster per angle, clip state, play data. Click, shift-click, ctrl-click. */
@Component({
  selector: 'tw-snap-list',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ClipStateBadge],
  template: `
    @let sel = selection();
    <ol
      class="snaps"
      role="listbox"
      aria-label="Snaps"
      aria-multiselectable="true"
      tabindex="0"
      [attr.aria-activedescendant]="sel.focusId !== null ? 'snap-option-' + sel.focusId : null"
    >
      @for (snap of snaps(); track snap.id) {
        <li
          role="option"
          [id]="'snap-option-' + snap.id"
          [attr.aria-selected]="chosen().has(snap.id)"
          [class.selected]="chosen().has(snap.id)"
          [class.focus]="sel.focusId === snap.id"
          data-testid="snap-row"
          (click)="pick(snap.id, $event)"
        >
          <span class="order" [attr.aria-label]="'Snap ' + snap.order">{{ snap.order }}</span>
          <span class="angles">
            @for (clip of clipsOf(snap); track clip.id) {
              <span class="angle">
                @if (clip.posterUrl) {
                  <img [src]="clip.posterUrl" alt="" width="64" height="36" loading="lazy" />
                } @else {
                  <span class="blank" aria-hidden="true"></span>
                }
                <span class="angle-name">{{ angleLabels[clip.angle] }}</span>
                @if (clip.status !== 'ready') {
                  <tw-clip-state [state]="clip.status" [progress]="clip.progress ?? null" />
                }
              </span>
            } @empty {
              <span class="muted">No video</span>
            }
          </span>
          <span class="summary" [class.muted]="!summaries().get(snap.id)">{{ summaries().get(snap.id) || 'No tags yet' }}</span>
        </li>
      }
    </ol>
  `,
  styleUrl: './snap-list.scss',
})
export class SnapList {
  readonly snaps = input.required<readonly Snap[]>();
  readonly clipsBySnap = input<ReadonlyMap<number, readonly SnapClipView[]>>(new Map());
  readonly selection = input.required<SnapSelection>();
  readonly tagName = input<(id: number) => string | undefined>(() => undefined);
  readonly picked = output<{ id: number; mode: PickMode }>();

  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  protected readonly angleLabels = ANGLE_LABELS;
  protected readonly chosen = computed(() => new Set(this.selection().ids));
  protected readonly summaries = computed(() => {
    const name = this.tagName();
    return new Map(this.snaps().map((snap) => [snap.id, snapSummary(snap, name)]));
  });

  constructor() {
    // Keep the snap in the player visible while J/K move through a long list.
    afterRenderEffect(() => {
      const id = this.selection().focusId;
      if (id === null) return;
      const row = this.host.nativeElement.querySelector<HTMLElement>(`#snap-option-${id}`);
      row?.scrollIntoView?.({ block: 'nearest' });
    });
  }

  protected clipsOf(snap: Snap): readonly SnapClipView[] {
    return this.clipsBySnap().get(snap.id) ?? snap.clips;
  }

  protected pick(id: number, event: MouseEvent): void {
    const mode: PickMode = event.shiftKey ? 'range' : event.ctrlKey || event.metaKey ? 'toggle' : 'only';
    this.picked.emit({ id, mode });
  }
}
