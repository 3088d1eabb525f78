import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { plural, studyState } from './clip-groups';
import { SnapGradeView } from './snap-grade';
import { snapTitle } from './snap-title';
import type { MyClip } from './study-api';
import { WatchedMeter } from './watched-meter';

/** One clip of the Study Queue: the whole card is the link to watch it. Sized for a thumb. */
@Component({
  selector: 'tw-study-clip-card',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, RouterLink, SnapGradeView, WatchedMeter],
  template: `
    @let c = clip();
    @let s = state();
    <a class="card" [routerLink]="['/study/clips', c.clipId]" data-testid="study-clip">
      <span class="poster">
        @if (c.posterUrl) {
          <img [src]="c.posterUrl" alt="" loading="lazy" />
        } @else {
          <mat-icon aria-hidden="true">movie</mat-icon>
        }
      </span>
      <span class="text">
        <span class="title">{{ title() }}</span>
        @if (s.points === 0) {
          <span class="points">
            <mat-icon aria-hidden="true">chat_bubble_outline</mat-icon>
            <span>No coaching points for you</span>
          </span>
        } @else if (s.allAcknowledged) {
          <span class="points done">
            <mat-icon aria-hidden="true">task_alt</mat-icon>
            <span>All got it · {{ s.points }} of {{ plural(s.points, 'point') }}</span>
          </span>
        } @else {
          <span class="points new">
            <mat-icon aria-hidden="true">mark_chat_unread</mat-icon>
            <span><strong>{{ s.newPoints }} new</strong> · {{ s.points - s.newPoints }} of {{ plural(s.points, 'point') }} got it</span>
          </span>
        }
        @if (gradesShared()) {
          @if (c.grade) {
            <tw-snap-grade [grade]="c.grade" />
          } @else {
            <span class="ungraded" data-testid="snap-ungraded">Not graded on this snap yet</span>
          }
        }
        <tw-watched-meter [fraction]="c.watchedFraction" />
      </span>
      <mat-icon class="go" aria-hidden="true">chevron_right</mat-icon>
    </a>
  `,
  styles: `
    :host {
      display: block;
    }
    .card {
      display: flex;
      align-items: center;
      gap: 12px;
      min-height: 88px;
      padding: 10px 8px 10px 10px;
      border-radius: 12px;
      border: 1px solid var(--mat-sys-outline-variant);
      background: var(--mat-sys-surface-container-lowest);
      color: inherit;
      text-decoration: none;
    }
    .card:hover {
      border-color: var(--tw-field-green);
    }
    .poster {
      flex: none;
      width: 112px;
      aspect-ratio: 16 / 9;
      border-radius: 8px;
      overflow: hidden;
      background: var(--tw-slate-ink);
      color: var(--tw-chalk);
      display: flex;
      align-items: center;
      justify-content: center;
      img {
        width: 100%;
        height: 100%;
        object-fit: cover;
      }
    }
    .text {
      flex: 1 1 auto;
      min-width: 0;
      display: flex;
      flex-direction: column;
      gap: 4px;
    }
    .title {
      font: var(--mat-sys-title-medium);
    }
    .points {
      display: flex;
      align-items: flex-start;
      gap: 4px;
      font: var(--mat-sys-body-medium);
      mat-icon {
        flex: none;
        font-size: 18px;
        width: 18px;
        height: 18px;
        margin-top: 1px;
      }
    }
    .points.new strong {
      padding: 0 6px;
      border-radius: 8px;
      background: var(--tw-signal-amber);
      color: var(--tw-slate-ink);
    }
    .points.done {
      color: var(--tw-field-green);
      font-weight: 600;
    }
    .go {
      flex: none;
      color: var(--mat-sys-on-surface-variant);
    }
    .ungraded {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class StudyClipCard {
  readonly clip = input.required<MyClip>();
  /** Whether his staff shares grades: only then does the card speak of grades at all. */
  readonly gradesShared = input(false);
  protected readonly plural = plural;
  protected readonly state = computed(() => studyState(this.clip()));
  protected readonly title = computed(() => snapTitle(this.clip().snapOrder, this.clip().angle));
}
