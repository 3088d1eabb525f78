import { Location } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, Injector, afterNextRender, computed, effect, inject, input, linkedSignal, numberAttribute, signal, untracked, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { Clip, FilmSession, Snap, TagListItem } from '@shared/api/film';
import type { Desk, GradingProgress } from '@shared/api/grading';
import { ANGLES } from '@shared/film';
import { AuthStore } from '../../core/auth/auth-store';
import { ConfirmDialog, ConfirmDialogData } from '../../core/feedback/confirm-dialog';
import { Notifier } from '../../core/feedback/notifier';
import { StatePanel } from '../../core/feedback/state-panel';
import { readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { PLAYER_SHORTCUTS } from '../snap-player/player-shortcuts';
import { PlayerSource, playerSourceFrom } from '../snap-player/player-source';
import { ShortcutHelpData, ShortcutHelpDialog } from '../snap-player/shortcut-help-dialog';
import { isPageShortcut, type ShortcutGroup } from '../snap-player/shortcut-keys';
import { ShortcutList } from '../snap-player/shortcut-list';
import { SnapPlayer } from '../snap-player/snap-player';
import { CompareData, CompareDialog } from './compare-dialog';
import { gridPlayers } from './desk-players';
import { DeskAction, GradeGrid } from './grade-grid';
import { actionFor, gradeShortcutGroups, keyName } from './grade-keys';
import { GradeSaveQueue } from './grade-save-queue';
import { GradingApi, Participant } from './grading-api';
import { GradingProgressPanel } from './grading-progress-panel';
import { KeyMapDialog } from './key-map-dialog';
import { KeyMapStore } from './key-map-store';
import { LineupEditor } from './lineup-editor';
import { PlayDataStrip } from './play-data-strip';
import { SaveStatus } from './save-status';
import { UnlockDialog } from './unlock-dialog';

const LOCK_ROLES = ['admin', 'coordinator'];
/** Progress is refetched at most this often while grades are being saved. */
const PROGRESS_REFRESH_MS = 4000;

/** The Grading Desk: one snap at a time, its video, its play data and the grade grid. */
@Component({
  selector: 'tw-grading-desk-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [GradeGrid, GradingProgressPanel, LineupEditor, MatButtonModule, MatIconModule, PlayDataStrip, RouterLink, SaveStatus, ShortcutList, SnapPlayer, StatePanel],
  templateUrl: './grading-desk-page.html',
  styleUrl: './grading-desk-page.scss',
  host: { '(document:keydown)': 'onKey($event)' },
})
export class GradingDeskPage {
  readonly sessionId = input.required({ transform: numberAttribute });
  /** The snap id from ?snap=, so a reload comes back to the same snap. */
  readonly snap = input<number | null, unknown>(null, { transform: (v: unknown) => (v === null || v === undefined || v === '' ? null : numberAttribute(v, 0) || null) });

  private readonly auth = inject(AuthStore);
  private readonly api = inject(GradingApi);
  private readonly queue = inject(GradeSaveQueue);
  private readonly keys = inject(KeyMapStore);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);
  private readonly location = inject(Location);
  private readonly injector = inject(Injector);
  private readonly grid = viewChild(GradeGrid);

  protected readonly desk = httpResource<Desk>(() => ({ url: `/api/film-sessions/${this.sessionId()}/desk`, context: inlineErrors() }));
  protected readonly session = httpResource<FilmSession>(() => ({ url: `/api/film-sessions/${this.sessionId()}`, context: inlineErrors() }));
  private readonly snapsResource = httpResource<{ snaps: Snap[] }>(() => ({ url: `/api/film-sessions/${this.sessionId()}/snaps`, context: inlineErrors() }));
  private readonly clipsResource = httpResource<{ clips: Clip[] }>(() => ({ url: `/api/film-sessions/${this.sessionId()}/clips`, context: inlineErrors() }));
  protected readonly progress = httpResource<GradingProgress>(() => ({ url: `/api/film-sessions/${this.sessionId()}/grading-progress`, context: inlineErrors() }));
  /** A number, so a lineup change (a new desk value) does not fetch the tag lists again. */
  private readonly teamId = computed(() => (this.desk.hasValue() ? this.desk.value().teamId : null));
  private readonly tagLists = httpResource<{ items: TagListItem[] }>(() => {
    const teamId = this.teamId();
    return teamId === null ? undefined : { url: `/api/teams/${teamId}/tag-lists`, context: inlineErrors() };
  });

  protected readonly canLock = computed(() => LOCK_ROLES.includes(this.auth.role() ?? ''));
  protected readonly locked = computed(() => {
    const fromServer = this.progress.hasValue() ? this.progress.value().locked : this.desk.hasValue() && this.desk.value().locked;
    return fromServer || this.queue.isLocked(this.sessionId());
  });
  protected readonly lockNote = computed(() => {
    const history = this.progress.hasValue() ? this.progress.value().lockHistory : [];
    const last = [...history].reverse().find((h) => h.action === 'locked');
    return last ? `Locked by ${last.by}.` : '';
  });

  protected readonly snaps = computed(() => (this.desk.hasValue() ? [...this.desk.value().snaps].sort((a, b) => a.order - b.order) : []));
  private readonly chosenId = linkedSignal<number | null>(() => this.snap());
  protected readonly index = computed(() => {
    const list = this.snaps();
    const found = list.findIndex((s) => s.snapId === this.chosenId());
    return found === -1 ? 0 : found;
  });
  protected readonly current = computed(() => this.snaps()[this.index()] ?? null);
  protected readonly players = computed(() => {
    const snap = this.current();
    return snap && this.desk.hasValue() ? gridPlayers(snap, this.desk.value().players) : [];
  });
  protected readonly otherGraders = computed(() => this.current()?.otherGraders ?? []);

  protected readonly playData = computed(() => {
    const id = this.current()?.snapId;
    return this.snapsResource.hasValue() ? (this.snapsResource.value().snaps.find((s) => s.id === id) ?? null) : null;
  });
  protected readonly tagItems = computed(() => (this.tagLists.hasValue() ? this.tagLists.value().items : []));

  private readonly sourcesBySnap = computed(() => {
    const map = new Map<number, PlayerSource[]>();
    const clips = this.clipsResource.hasValue() ? this.clipsResource.value().clips : [];
    for (const clip of clips) {
      const source = clip.kind === 'snap' && clip.snapId !== null ? playerSourceFrom(clip) : null;
      if (source && clip.snapId !== null) map.set(clip.snapId, [...(map.get(clip.snapId) ?? []), source]);
    }
    for (const list of map.values()) list.sort((a, b) => ANGLES.indexOf(a.angle) - ANGLES.indexOf(b.angle));
    return map;
  });
  protected readonly sources = computed(() => this.sourcesBySnap().get(this.current()?.snapId ?? -1) ?? []);
  protected readonly preloadUrl = computed(() => {
    const next = this.snaps()[this.index() + 1];
    return next ? (this.sourcesBySnap().get(next.snapId)?.[0]?.playbackUrl ?? null) : null;
  });

  /** Snaps where every lineman on the field has an assignment mark from this coach. */
  protected readonly gradedSnaps = computed(() => {
    const snaps = this.snaps();
    return snaps.filter((s) => s.participants.length > 0 && s.participants.every((p) => this.queue.draftFor(s.snapId, p.playerId).assignment !== null)).length;
  });

  protected readonly legend = computed<ShortcutGroup[]>(() => {
    const scheme = this.desk.hasValue() ? this.desk.value().scheme : null;
    const groups = gradeShortcutGroups(this.keys.map());
    if (!scheme) return [...groups, PLAYER_SHORTCUTS];
    const numbered = (list: readonly string[]) => list.slice(0, 9).map((item, i) => ({ keys: [String(i + 1)], action: item }));
    return [
      ...groups,
      { title: 'Missed reasons (on Assignment)', shortcuts: numbered(scheme.missedReasons) },
      { title: 'Penalty types (on Penalties)', shortcuts: numbered(scheme.penaltyTypes) },
      PLAYER_SHORTCUTS,
    ];
  });

  protected readonly lineupSaving = signal(false);
  private progressTimer: ReturnType<typeof setTimeout> | null = null;

  constructor() {
    this.queue.start();
    // The desk's grades become the queue's known versions; unsent changes stay on top of them.
    effect(() => {
      if (!this.desk.hasValue()) return;
      const desk = this.desk.value();
      untracked(() => {
        this.queue.absorb(desk.snaps.flatMap((s) => s.myGrades));
        this.queue.setLocked(desk.sessionId, desk.locked);
      });
    });
    effect(() => {
      if (this.progress.hasValue()) {
        const locked = this.progress.value().locked;
        untracked(() => this.queue.setLocked(this.sessionId(), locked));
      }
    });
    // Saved grades move the progress bar, without a request per key.
    effect(() => {
      if (this.queue.savedCount() === 0) return;
      untracked(() => {
        this.progressTimer ??= setTimeout(() => {
          this.progressTimer = null;
          this.progress.reload();
        }, PROGRESS_REFRESH_MS);
      });
    });
    inject(DestroyRef).onDestroy(() => {
      if (this.progressTimer) clearTimeout(this.progressTimer);
    });
    // The grid has the keyboard once the first snap is shown.
    let focused = false;
    effect(() => {
      if (focused || !this.grid() || this.players().length === 0) return;
      focused = true;
      afterNextRender(() => this.grid()?.focus(), { injector: this.injector });
    });
  }

  protected go(step: number): void {
    const list = this.snaps();
    const target = list[this.index() + step];
    if (!target) {
      this.notifier.info(step > 0 ? 'That was the last snap of this session.' : 'This is the first snap.');
      return;
    }
    this.showSnap(target.snapId);
  }

  protected pick(event: Event): void {
    this.showSnap(Number((event.target as HTMLSelectElement).value));
  }

  private showSnap(snapId: number): void {
    this.chosenId.set(snapId);
    const path = this.location.path().split('?')[0];
    this.location.replaceState(path, `snap=${snapId}`);
    afterNextRender(() => this.grid()?.focus(), { injector: this.injector });
  }

  protected onDeskAction(action: DeskAction): void {
    if (action === 'nextSnap') this.go(1);
    else if (action === 'previousSnap') this.go(-1);
    else if (action === 'compare') this.openCompare();
    else this.openHelp();
  }

  /** Desk keys also work when the focus is outside the grid (on the video, the page). */
  protected onKey(event: KeyboardEvent): void {
    if (!isPageShortcut(event)) return;
    const name = keyName(event);
    const action = name === null ? null : actionFor(this.keys.map(), name);
    if (action === 'nextSnap' || action === 'previousSnap' || action === 'compare' || action === 'help') {
      event.preventDefault();
      this.onDeskAction(action);
    } else if (action === 'focusGrid') {
      event.preventDefault();
      this.grid()?.focus();
    }
  }

  protected openHelp(): void {
    const data: ShortcutHelpData = {
      title: 'Grading Desk keys',
      note: 'Grid keys work while a grade cell has the focus. In the grid, Space, Shift+←/→, [ ], A, I and O still drive the video. Change the keys under “Keys”.',
      groups: this.legend(),
    };
    this.dialog.open(ShortcutHelpDialog, { data, width: '820px', maxWidth: '96vw' });
  }

  protected openKeyMap(): void {
    this.dialog.open(KeyMapDialog, { width: '720px', maxWidth: '96vw' });
  }

  protected openCompare(): void {
    const snap = this.current();
    if (!snap || !this.desk.hasValue()) return;
    const data: CompareData = { snapId: snap.snapId, snapOrder: snap.order, players: this.players(), scheme: this.desk.value().scheme };
    this.dialog.open(CompareDialog, { data, width: '900px', maxWidth: '96vw' });
  }

  protected onPlaySaved(saved: Snap): void {
    this.snapsResource.update((value) => (value ? { snaps: value.snaps.map((s) => (s.id === saved.id ? saved : s)) } : value));
  }

  protected saveLineup(participants: Participant[]): void {
    const snap = this.current();
    if (!snap) return;
    this.lineupSaving.set(true);
    this.api.saveParticipants(snap.snapId, participants).subscribe({
      next: (result) => {
        this.lineupSaving.set(false);
        this.desk.update((desk) =>
          desk ? { ...desk, snaps: desk.snaps.map((s) => (s.snapId === snap.snapId ? { ...s, participants: result.participants, participantsFromDepthChart: false } : s)) } : desk,
        );
      },
      error: (failure: unknown) => {
        this.lineupSaving.set(false);
        this.notifier.error(`The lineup of snap ${snap.order} was not saved: ${readApiError(failure).message}`);
      },
    });
  }

  protected lock(): void {
    const data: ConfirmDialogData = {
      title: 'Lock grading?',
      message: 'Nobody can change grades of this session until a coordinator or admin unlocks it. Changes still waiting in browsers are held.',
      confirmLabel: 'Lock grading',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .subscribe((yes) => {
        if (yes) this.setLock(true);
      });
  }

  protected unlock(): void {
    this.dialog
      .open<UnlockDialog, void, string>(UnlockDialog, { width: '480px', maxWidth: '96vw' })
      .afterClosed()
      .subscribe((reason) => {
        if (reason) this.setLock(false, reason);
      });
  }

  private setLock(locked: boolean, reason?: string): void {
    this.api.setLock(this.sessionId(), locked, reason).subscribe({
      next: (progress) => {
        this.progress.set(progress);
        this.queue.setLocked(this.sessionId(), progress.locked);
        this.notifier.info(progress.locked ? 'Grading of this session is locked.' : 'Grading is open again.');
      },
      error: (failure: unknown) => this.notifier.error(readApiError(failure).message),
    });
  }
}
