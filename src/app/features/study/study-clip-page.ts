import { DOCUMENT } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, linkedSignal, numberAttribute, signal, untracked, viewChild } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Title } from '@angular/platform-browser';
import { RouterLink } from '@angular/router';
import type { Comment } from '@shared/api/film-room';
import { formatClock } from '@shared/film';
import { AuthStore } from '../../core/auth/auth-store';
import { Notifier } from '../../core/feedback/notifier';
import { SafetyNote } from '../../core/feedback/safety-note';
import { StatePanel } from '../../core/feedback/state-panel';
import { readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { CommentThread, ThreadViewer } from '../coaching-points/comment-thread';
import { CommentsApi } from '../coaching-points/comments-api';
import { activePointId, threadsInOrder, toMarkers } from '../coaching-points/point-threads';
import { PointMarkers } from '../coaching-points/point-markers';
import { SnapPlayer } from '../snap-player/snap-player';
import { clipSource } from './clip-source';
import { PlayerHooks } from './player-hooks';
import { snapTitle } from './snap-title';
import { MY_CLIPS_URL, MyClip, StudyApi } from './study-api';
import { ViewReporter } from './view-reporter';
import { WatchedMeter } from './watched-meter';

/** ?at=ms from a mail link: a whole number of milliseconds, anything else is ignored. */
export function atParam(value: unknown): number | undefined {
  if (value === null || value === undefined || value === '') return undefined;
  const ms = Number(value);
  return Number.isInteger(ms) && ms >= 0 ? ms : undefined;
}

/**
 * A player's view of one clip: the video with his coaching points along it, each point to read,
 * say "Got it" to and answer, and a question at any moment. Reports what he watched as he plays.
 */
@Component({
  selector: 'tw-study-clip-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [CommentThread, FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, PlayerHooks, PointMarkers, RouterLink, SafetyNote, SnapPlayer, StatePanel, WatchedMeter],
  templateUrl: './study-clip-page.html',
  styleUrl: './study-clip-page.scss',
})
export class StudyClipPage {
  readonly clipId = input.required({ transform: numberAttribute });
  readonly at = input(undefined, { transform: atParam });

  private readonly auth = inject(AuthStore);
  private readonly studyApi = inject(StudyApi);
  private readonly commentsApi = inject(CommentsApi);
  private readonly notifier = inject(Notifier);
  private readonly document = inject(DOCUMENT);
  private readonly player = viewChild(SnapPlayer);
  private readonly hooks = viewChild(PlayerHooks);

  protected readonly clock = formatClock;

  protected readonly queue = httpResource<{ clips: MyClip[] }>(() => ({ url: MY_CLIPS_URL, context: inlineErrors() }));
  protected readonly comments = httpResource<{ comments: Comment[] }>(() => ({ url: this.commentsApi.listUrl(this.clipId()), context: inlineErrors() }));

  protected readonly clip = computed(() => (this.queue.hasValue() ? (this.queue.value().clips.find((c) => c.clipId === this.clipId()) ?? null) : null));
  protected readonly title = computed(() => {
    const c = this.clip();
    if (!c) return 'Clip';
    return snapTitle(c.snapOrder, c.angle);
  });
  protected readonly sources = computed(() => {
    const c = this.clip();
    return c ? clipSource(c) : [];
  });

  protected readonly threads = computed(() => threadsInOrder(this.comments.hasValue() ? this.comments.value().comments : []));
  protected readonly markers = computed(() => toMarkers(this.threads()));
  protected readonly timeMs = signal(0);
  protected readonly activeId = computed(() => activePointId(this.threads(), this.timeMs()));
  protected readonly durationMs = computed(() => this.clip()?.durationMs ?? 0);
  protected readonly watched = linkedSignal(() => this.clip()?.watchedFraction ?? 0);

  protected readonly viewer = computed<ThreadViewer>(() => ({
    userId: this.auth.user()?.id ?? null,
    playerId: this.auth.membership()?.playerId ?? null,
    canModerate: false,
    isStaff: false,
  }));

  /** The moment a question is about, while the question box is open. */
  protected readonly askingAt = signal<number | null>(null);
  protected readonly question = signal('');
  protected readonly sending = signal(false);
  protected readonly askProblem = signal<string | null>(null);

  private reporter: ViewReporter | null = null;
  private readonly ready = signal(false);

  constructor() {
    const title = inject(Title);
    effect(() => title.setTitle(`${this.title()} · Study · Trenchwork`));
    // One reporter per clip: moving to another clip sends what is left of the last one.
    effect(() => {
      const clipId = this.clipId();
      untracked(() => {
        this.reporter?.stop();
        this.ready.set(false);
        this.reporter = new ViewReporter(
          (fromMs, toMs) => this.studyApi.recordView(clipId, fromMs, toMs),
          (fraction) => this.watched.set(fraction),
        );
      });
    });
    // Start at ?at= once the video can seek, and again if the link changes while here.
    effect(() => {
      const at = this.at();
      if (!this.ready() || at === undefined) return;
      untracked(() => this.player()?.seekTo(at));
    });
    inject(DestroyRef).onDestroy(() => this.reporter?.stop());
  }

  protected onReady(): void {
    this.ready.set(true);
  }

  protected onTime(ms: number): void {
    this.timeMs.set(ms);
    this.reporter?.time(ms);
  }

  protected onPlay(): void {
    this.reporter?.playing(this.player()?.currentMs() ?? this.timeMs());
  }

  protected onPause(): void {
    this.reporter?.paused(this.player()?.currentMs() ?? this.timeMs());
  }

  /** From a marker or a point: go to its moment and play from there. */
  protected playFrom(atMs: number): void {
    this.player()?.seekTo(atMs);
    this.hooks()?.play();
  }

  protected pickMarker(id: number): void {
    const thread = this.threads().find((t) => t.id === id);
    if (!thread) return;
    this.playFrom(thread.atMs);
    // jsdom has no scrollIntoView; browsers all do.
    this.document.getElementById(`point-${id}`)?.scrollIntoView?.({ block: 'nearest', behavior: 'smooth' });
  }

  protected openQuestion(): void {
    const player = this.player();
    player?.pause();
    this.askProblem.set(null);
    this.askingAt.set(player?.currentMs() ?? this.timeMs());
  }

  protected closeQuestion(): void {
    this.askingAt.set(null);
    this.question.set('');
  }

  protected sendQuestion(): void {
    const atMs = this.askingAt();
    const body = this.question().trim();
    if (atMs === null) return;
    if (!body) {
      this.askProblem.set('Write your question first.');
      return;
    }
    this.sending.set(true);
    this.askProblem.set(null);
    this.commentsApi.ask(this.clipId(), Math.round(atMs), body).subscribe({
      next: () => {
        this.sending.set(false);
        this.closeQuestion();
        this.notifier.info('Question sent. Your coach answers here.');
        this.comments.reload();
      },
      error: (failure: unknown) => {
        this.sending.set(false);
        this.askProblem.set(readApiError(failure).message);
      },
    });
  }
}
