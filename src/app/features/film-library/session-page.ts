import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, linkedSignal, numberAttribute, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { Title } from '@angular/platform-browser';
import { RouterLink } from '@angular/router';
import { Subject, map, startWith, switchMap } from 'rxjs';
import type { Clip, FilmSession, Snap, TagListItem } from '@shared/api/film';
import { ANGLES, ANGLE_LABELS } from '@shared/film';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { PLAYER_SHORTCUTS } from '../snap-player/player-shortcuts';
import { PlayerSource, playerSourceFrom } from '../snap-player/player-source';
import { ShortcutHelpData, ShortcutHelpDialog } from '../snap-player/shortcut-help-dialog';
import { isPageShortcut } from '../snap-player/shortcut-keys';
import { SnapPlayer } from '../snap-player/snap-player';
import { ClipCounts } from './clip-counts';
import { SESSION_KIND_LABELS, allClipsFinal } from './clip-states';
import { ClipTray } from './clip-tray';
import { FilmApi } from './film-api';
import type { HasRunningUploads } from './leave-guard';
import { PollState, pollUntilFinal } from './poll-until-final';
import { opponentLine } from './session-title';
import { SnapClipView, SnapList } from './snap-list';
import { NO_SELECTION, PickMode, SnapSelection, pickSnap, stepSelection } from './snap-selection';
import { SnapTagsImport } from './snap-tags-import';
import { SnapTagsPanel } from './snap-tags-panel';
import { SNAP_LIST_SHORTCUTS, TAG_SHORTCUTS } from './tag-keys';
import { UploadPanel } from './upload-panel';

const byAngle = (a: { angle: string }, b: { angle: string }) => ANGLES.indexOf(a.angle as never) - ANGLES.indexOf(b.angle as never);

/**
 * One film session: the snaps in order with their angles and states, the player, Snap Tags,
 * clips that need a hand, and the upload panel. Clip states update live while work is pending.
 */
@Component({
  selector: 'tw-session-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ClipCounts, ClipTray, DatePipe, MatButtonModule, MatIconModule, RouterLink, SnapList, SnapPlayer, SnapTagsImport, SnapTagsPanel, StatePanel, UploadPanel],
  templateUrl: './session-page.html',
  styleUrl: './session-page.scss',
  host: { '(document:keydown)': 'onKey($event)' },
})
export class SessionPage implements HasRunningUploads {
  readonly sessionId = input.required({ transform: numberAttribute });

  private readonly api = inject(FilmApi);
  private readonly dialog = inject(MatDialog);
  private readonly tagsPanel = viewChild(SnapTagsPanel);
  private readonly uploadPanel = viewChild(UploadPanel);

  protected readonly kindLabels = SESSION_KIND_LABELS;
  protected readonly opponentLine = opponentLine;
  protected readonly angleLabels = ANGLE_LABELS;

  protected readonly session = httpResource<FilmSession>(() => ({ url: `/api/film-sessions/${this.sessionId()}`, context: inlineErrors() }));
  protected readonly snapsResource = httpResource<{ snaps: Snap[] }>(() => ({ url: `/api/film-sessions/${this.sessionId()}/snaps`, context: inlineErrors() }));
  protected readonly tagLists = httpResource<{ items: TagListItem[] }>(() => {
    const session = this.session.hasValue() ? this.session.value() : null;
    return session ? { url: `/api/teams/${session.teamId}/tag-lists`, context: inlineErrors() } : undefined;
  });

  private readonly restartPolling = new Subject<void>();
  /** Polls every 2 s while a clip is received or processing; stops when all are final or the page is left. */
  private readonly poll = toSignal(
    toObservable(this.sessionId).pipe(
      switchMap((id) =>
        this.restartPolling.pipe(
          startWith(undefined),
          switchMap(() => pollUntilFinal(() => this.api.sessionClips(id).pipe(map((r) => r.clips)), allClipsFinal)),
        ),
      ),
    ),
    { initialValue: { value: null, error: null } as PollState<Clip[]> },
  );
  /** The last clip list we had, kept while polling restarts. */
  protected readonly clips = linkedSignal<PollState<Clip[]>, Clip[] | null>({
    source: this.poll,
    computation: (state, previous) => state.value ?? previous?.value ?? null,
  });
  protected readonly pollError = computed(() => this.poll().error);

  protected readonly snaps = computed(() => (this.snapsResource.hasValue() ? this.snapsResource.value().snaps : []));
  private readonly order = computed(() => this.snaps().map((s) => s.id));
  protected readonly clipList = computed(() => this.clips() ?? []);
  protected readonly counts = computed(() => {
    const counts = { received: 0, processing: 0, ready: 0, failed: 0 };
    for (const clip of this.clipList()) counts[clip.status] += 1;
    return counts;
  });

  /** Clips per snap, fresh from polling (before the first poll, what the snap list said). */
  protected readonly clipsBySnap = computed(() => {
    const result = new Map<number, SnapClipView[]>();
    const fresh = this.clips();
    if (fresh === null) {
      for (const snap of this.snaps()) result.set(snap.id, [...snap.clips].sort(byAngle));
      return result;
    }
    for (const clip of fresh) {
      if (clip.snapId === null || clip.kind !== 'snap') continue;
      result.set(clip.snapId, [...(result.get(clip.snapId) ?? []), clip].sort(byAngle));
    }
    return result;
  });

  private readonly selection = signal<SnapSelection>(NO_SELECTION);
  /** The selection as it stands in the current list; the first snap when nothing is picked. */
  protected readonly selected = computed<SnapSelection>(() => {
    const order = this.order();
    const current = this.selection();
    const ids = current.ids.filter((id) => order.includes(id));
    if (ids.length > 0) return { ...current, ids, focusId: current.focusId !== null && ids.includes(current.focusId) ? current.focusId : ids[0] };
    return order.length > 0 ? { anchorId: order[0], focusId: order[0], ids: [order[0]] } : NO_SELECTION;
  });
  protected readonly focusSnap = computed(() => this.snaps().find((s) => s.id === this.selected().focusId) ?? null);
  protected readonly targets = computed(() => {
    const ids = new Set(this.selected().ids);
    return this.snaps().filter((s) => ids.has(s.id));
  });

  protected readonly sources = computed(() => this.sourcesOf(this.focusSnap()));
  protected readonly preloadUrl = computed(() => {
    const focus = this.focusSnap();
    const next = focus ? this.snaps().find((s) => s.order > focus.order) : undefined;
    return this.sourcesOf(next ?? null)[0]?.playbackUrl ?? null;
  });

  protected readonly tagItems = computed(() => (this.tagLists.hasValue() ? this.tagLists.value().items : []));
  protected readonly tagName = computed(() => {
    const names = new Map(this.tagItems().map((item) => [item.id, item.name]));
    return (id: number) => names.get(id);
  });
  protected readonly exportUrl = computed(() => this.api.snapTagsExportUrl(this.sessionId()));

  private lastMissing = '';

  constructor() {
    const title = inject(Title);
    effect(() => {
      if (this.session.hasValue()) title.setTitle(`${this.session.value().title} · Film Library · Trenchwork`);
    });
    // Uploads and tape splits make snaps on the server; fetch the list when a clip points at one we lack.
    effect(() => {
      const known = new Set(this.order());
      if (!this.snapsResource.hasValue() || this.snapsResource.isLoading()) return;
      const missing = [...new Set(this.clipList().flatMap((c) => (c.snapId !== null && !known.has(c.snapId) ? [c.snapId] : [])))].sort().join(',');
      if (missing !== '' && missing !== this.lastMissing) {
        this.lastMissing = missing;
        this.snapsResource.reload();
      }
    });
  }

  uploadsRunning(): boolean {
    return this.uploadPanel()?.uploadsRunning() ?? false;
  }

  /** Something changed on the server: poll clips again and fetch the snaps. */
  protected refresh(): void {
    this.restartPolling.next();
    this.snapsResource.reload();
  }

  protected onUploaded(): void {
    this.restartPolling.next();
  }

  protected onSaved(saved: readonly Snap[]): void {
    const byId = new Map(saved.map((s) => [s.id, s]));
    this.snapsResource.update((value) => (value ? { snaps: value.snaps.map((s) => byId.get(s.id) ?? s) } : value));
  }

  protected async onPick(pick: { id: number; mode: PickMode }): Promise<void> {
    if (!(await this.saveFirst())) return;
    this.selection.set(pickSnap(this.order(), this.selected(), pick.id, pick.mode));
  }

  protected openHelp(): void {
    const data: ShortcutHelpData = {
      title: 'Keyboard shortcuts',
      note: 'Single keys work when no field has the cursor; Esc leaves a field.',
      groups: [SNAP_LIST_SHORTCUTS, TAG_SHORTCUTS, PLAYER_SHORTCUTS],
    };
    this.dialog.open(ShortcutHelpDialog, { data, width: '760px', maxWidth: '96vw' });
  }

  protected onKey(event: KeyboardEvent): void {
    if (!isPageShortcut(event)) return;
    switch (event.key) {
      case 'j':
      case 'J':
      case 'ArrowDown':
        void this.step(1, event.shiftKey);
        break;
      case 'k':
      case 'K':
      case 'ArrowUp':
        void this.step(-1, event.shiftKey);
        break;
      case '?':
        this.openHelp();
        break;
      case 'Escape': {
        const focus = this.selected().focusId;
        if (focus === null || this.selected().ids.length < 2) return;
        this.selection.set(pickSnap(this.order(), this.selected(), focus, 'only'));
        break;
      }
      default:
        return;
    }
    event.preventDefault();
  }

  private async step(delta: number, extend: boolean): Promise<void> {
    if (!(await this.saveFirst())) return;
    this.selection.set(stepSelection(this.order(), this.selected(), delta, extend));
  }

  /** Moving to another snap saves the tags typed so far; a failed save keeps the analyst where they are. */
  private saveFirst(): Promise<boolean> {
    return this.tagsPanel()?.saveIfChanged() ?? Promise.resolve(true);
  }

  private sourcesOf(snap: Snap | null): PlayerSource[] {
    if (!snap) return [];
    const clips = this.clips() ?? [];
    return clips
      .filter((c) => c.snapId === snap.id && c.kind === 'snap')
      .sort(byAngle)
      .map(playerSourceFrom)
      .filter((s): s is PlayerSource => s !== null);
  }
}
