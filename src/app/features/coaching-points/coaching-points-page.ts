import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, numberAttribute, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Title } from '@angular/platform-browser';
import { RouterLink } from '@angular/router';
import type { Clip, FilmSession } from '@shared/api/film';
import type { Comment } from '@shared/api/film-room';
import type { Desk } from '@shared/api/grading';
import type { PlayerListResponse } from '@shared/api/roster';
import { ANGLE_LABELS } from '@shared/film';
import { GRADING_ROLES, type Role } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { SafetyNote } from '../../core/feedback/safety-note';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { PLAYER_SHORTCUTS } from '../snap-player/player-shortcuts';
import { playerSourceFrom } from '../snap-player/player-source';
import { isPageShortcut } from '../snap-player/shortcut-keys';
import { ShortcutList } from '../snap-player/shortcut-list';
import { SnapPlayer } from '../snap-player/snap-player';
import { CommentThread, ThreadViewer } from './comment-thread';
import { CommentsApi } from './comments-api';
import { pointAudience } from './point-audience';
import { PointForm } from './point-form';
import { POINT_COMPONENT_LABELS, POINT_COMPONENTS } from './point-labels';
import { PointMarkers } from './point-markers';
import { POINT_SHORTCUTS } from './point-shortcuts';
import { activePointId, threadsInOrder, toMarkers } from './point-threads';

/** The API lets these roles remove anyone's comment (DELETE /api/comments/{id}). */
const MODERATOR_ROLES: readonly Role[] = ['admin', 'coordinator'];

/**
 * The staff side of one clip's coaching points: the video with its points along it, the form to add
 * one at the current moment or over a span, and every thread with replies and who got it.
 */
@Component({
  selector: 'tw-coaching-points-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [CommentThread, MatButtonModule, MatIconModule, PointForm, PointMarkers, RouterLink, SafetyNote, ShortcutList, SnapPlayer, StatePanel],
  templateUrl: './coaching-points-page.html',
  styleUrl: './coaching-points-page.scss',
  host: { '(document:keydown)': 'onKey($event)' },
})
export class CoachingPointsPage {
  readonly sessionId = input.required({ transform: numberAttribute });
  readonly clipId = input.required({ transform: numberAttribute });

  private readonly auth = inject(AuthStore);
  private readonly commentsApi = inject(CommentsApi);
  private readonly player = viewChild(SnapPlayer);
  private readonly pointForm = viewChild(PointForm);

  protected readonly canWrite = computed(() => GRADING_ROLES.includes(this.auth.role() ?? 'player'));
  protected readonly shortcuts = computed(() => (this.canWrite() ? [PLAYER_SHORTCUTS, POINT_SHORTCUTS] : [PLAYER_SHORTCUTS]));

  protected readonly session = httpResource<FilmSession>(() => ({ url: `/api/film-sessions/${this.sessionId()}`, context: inlineErrors() }));
  protected readonly clip = httpResource<Clip>(() => ({ url: `/api/clips/${this.clipId()}`, context: inlineErrors() }));
  protected readonly comments = httpResource<{ comments: Comment[] }>(() => ({ url: this.commentsApi.listUrl(this.clipId()), context: inlineErrors() }));
  /** Who was on the snap; only coaches have the desk. */
  protected readonly desk = httpResource<Desk>(() => (this.canWrite() ? { url: `/api/film-sessions/${this.sessionId()}/desk`, context: inlineErrors() } : undefined));
  /** Without the desk (it failed), the form offers the roster instead. */
  private readonly roster = httpResource<PlayerListResponse>(() => {
    const teamId = this.auth.teamId();
    if (!this.canWrite() || this.desk.status() !== 'error' || teamId === null) return undefined;
    return { url: `/api/teams/${teamId}/players`, context: inlineErrors() };
  });

  protected readonly sources = computed(() => {
    const source = this.clip.hasValue() ? playerSourceFrom(this.clip.value()) : null;
    return source ? [source] : [];
  });
  protected readonly title = computed(() => {
    if (!this.clip.hasValue()) return 'Coaching points';
    const clip = this.clip.value();
    const snap = this.desk.hasValue() ? this.desk.value().snaps.find((s) => s.snapId === clip.snapId) : undefined;
    return `${snap ? `Snap ${snap.order}` : 'Clip'} · ${ANGLE_LABELS[clip.angle]}`;
  });

  protected readonly audience = computed(() =>
    pointAudience(this.desk.hasValue() ? this.desk.value() : null, this.clip.hasValue() ? this.clip.value().snapId : null, this.roster.hasValue() ? this.roster.value().players : []),
  );
  private readonly extraComponents = computed(() => (this.desk.hasValue() ? this.desk.value().scheme.extraComponents.filter((c) => c.active) : []));
  protected readonly extraLabels = computed(() => new Map(this.extraComponents().map((c) => [c.key, c.label])));
  protected readonly components = computed(() => [
    ...POINT_COMPONENTS.map((key) => ({ key, label: POINT_COMPONENT_LABELS[key] })),
    ...this.extraComponents().map((c) => ({ key: c.key, label: c.label })),
  ]);

  protected readonly threads = computed(() => threadsInOrder(this.comments.hasValue() ? this.comments.value().comments : []));
  protected readonly markers = computed(() => toMarkers(this.threads()));
  protected readonly timeMs = signal(0);
  protected readonly activeId = computed(() => activePointId(this.threads(), this.timeMs()));
  protected readonly durationMs = computed(() => (this.clip.hasValue() ? (this.clip.value().durationMs ?? 0) : 0));

  protected readonly viewer = computed<ThreadViewer>(() => ({
    userId: this.auth.user()?.id ?? null,
    playerId: null,
    canModerate: MODERATOR_ROLES.includes(this.auth.role() ?? 'player'),
    isStaff: true,
  }));

  constructor() {
    const title = inject(Title);
    effect(() => title.setTitle(`Coaching points · ${this.title()} · Trenchwork`));
  }

  protected seek(atMs: number): void {
    this.player()?.seekTo(atMs);
  }

  protected pickMarker(id: number): void {
    const thread = this.threads().find((t) => t.id === id);
    if (thread) this.seek(thread.atMs);
  }

  protected onCreated(): void {
    this.comments.reload();
  }

  /** P: a new point at the current moment; the video stops so the coach can write. */
  protected onKey(event: KeyboardEvent): void {
    if (!this.canWrite() || !isPageShortcut(event) || (event.key !== 'p' && event.key !== 'P')) return;
    const player = this.player();
    const form = this.pointForm();
    if (!form) return;
    player?.pause();
    form.startAt(player?.currentMs() ?? this.timeMs());
    event.preventDefault();
  }
}
