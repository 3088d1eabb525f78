import { ChangeDetectionStrategy, Component, computed, effect, inject, input, linkedSignal, numberAttribute, signal, untracked, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSliderModule } from '@angular/material/slider';
import { Router, RouterLink } from '@angular/router';
import { Subject, firstValueFrom, startWith, switchMap } from 'rxjs';
import type { Clip } from '@shared/api/film';
import { formatClock } from '@shared/film';
import { ConfirmDialog, ConfirmDialogData } from '../../core/feedback/confirm-dialog';
import { Notifier } from '../../core/feedback/notifier';
import { readApiError } from '../../core/http/api-error';
import { isFinalState } from '../film-library/clip-states';
import { FilmApi } from '../film-library/film-api';
import { PollState, pollUntilFinal } from '../film-library/poll-until-final';
import { PLAYER_SHORTCUTS } from '../snap-player/player-shortcuts';
import { PlayerSource, playerSourceFrom } from '../snap-player/player-source';
import { ShortcutHelpData, ShortcutHelpDialog } from '../snap-player/shortcut-help-dialog';
import { ShortcutGroup, isPageShortcut } from '../snap-player/shortcut-keys';
import { ShortcutList } from '../snap-player/shortcut-list';
import { SnapPlayer } from '../snap-player/snap-player';
import { CutTimeline } from './cut-timeline';
import { addCut, moveCut, removeCut, shortCutIndexes, sortCuts } from './tape-cuts';

const CUT_SHORTCUTS: ShortcutGroup = {
  title: 'Cuts',
  shortcuts: [
    { keys: ['C'], action: 'Add a cut at the current frame' },
    { keys: ['Delete', 'Backspace'], action: 'Remove the selected cut' },
    { keys: ['M'], action: 'Move the selected cut to the current frame' },
    { keys: [',', '.'], action: 'Select the previous or next cut' },
    { keys: ['?'], action: 'All shortcuts' },
  ],
};

/**
 * Cut Planner: a continuous tape becomes snaps. The detected scene changes are proposed as cuts;
 * the analyst adds, removes and drags them, may detect again with another threshold, and confirms.
 */
@Component({
  selector: 'tw-cut-planner-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [CutTimeline, MatButtonModule, MatIconModule, MatProgressBarModule, MatSliderModule, RouterLink, ShortcutList, SnapPlayer],
  templateUrl: './cut-planner-page.html',
  styleUrl: './cut-planner-page.scss',
  host: { '(document:keydown)': 'onKey($event)' },
})
export class CutPlannerPage {
  readonly sessionId = input.required({ transform: numberAttribute });
  readonly clipId = input.required({ transform: numberAttribute });

  private readonly api = inject(FilmApi);
  private readonly router = inject(Router);
  private readonly notifier = inject(Notifier);
  private readonly dialog = inject(MatDialog);
  private readonly player = viewChild(SnapPlayer);

  protected readonly clock = formatClock;
  protected readonly shortcutGroups = [CUT_SHORTCUTS];

  private readonly restartPolling = new Subject<void>();
  private readonly poll = toSignal(
    toObservable(this.clipId).pipe(
      switchMap((id) => this.restartPolling.pipe(startWith(undefined), switchMap(() => pollUntilFinal(() => this.api.clip(id), (c) => isFinalState(c.status))))),
    ),
    { initialValue: { value: null, error: null } as PollState<Clip> },
  );
  protected readonly tape = computed(() => this.poll().value);
  protected readonly loadError = computed(() => (this.poll().value === null ? this.poll().error : null));

  /** Detecting again makes the tape "processing", which hides its video; keep playing what we had. */
  private readonly source = linkedSignal<Clip | null, PlayerSource | null>({
    source: this.tape,
    computation: (tape, previous) => (tape ? playerSourceFrom(tape) : null) ?? previous?.value ?? null,
  });
  protected readonly sources = computed<PlayerSource[]>(() => {
    const source = this.source();
    return source ? [source] : [];
  });
  protected readonly durationMs = computed(() => this.tape()?.durationMs ?? this.source()?.durationMs ?? 0);

  protected readonly cuts = signal<number[]>([]);
  protected readonly selected = signal<number | null>(null);
  protected readonly edited = signal(false);
  protected readonly threshold = signal(0.3);
  /** True from "detect again" until the new proposal is in. */
  protected readonly detecting = signal(false);
  protected readonly splitting = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly playheadMs = signal(0);
  private proposalTaken = false;

  protected readonly shortIndexes = computed(() => shortCutIndexes(this.cuts(), this.durationMs()));
  protected readonly snapCount = computed(() => this.cuts().length + 1);

  constructor() {
    // The proposal becomes the plan when the tape is first ready, and again after each new detection.
    effect(() => {
      const tape = this.tape();
      if (!tape || tape.kind !== 'tape' || tape.status !== 'ready') return;
      untracked(() => {
        if (this.proposalTaken && !this.detecting()) return;
        this.proposalTaken = true;
        this.detecting.set(false);
        this.cuts.set(sortCuts(tape.proposedCutsMs ?? []));
        this.selected.set(null);
        this.edited.set(false);
      });
    });
  }

  protected addCutHere(): void {
    const at = this.player()?.currentMs() ?? this.playheadMs();
    this.apply(addCut(this.cuts(), at, this.durationMs()), `Cut added at ${formatClock(at)}.`);
  }

  protected removeSelected(): void {
    const index = this.selected();
    if (index === null) return;
    const at = this.cuts()[index];
    this.cuts.set(removeCut(this.cuts(), index));
    this.selected.set(null);
    this.edited.set(true);
    this.problem.set(null);
    this.notice.set(`Cut at ${formatClock(at)} removed.`);
  }

  protected moveSelectedHere(): void {
    const index = this.selected();
    if (index === null) return;
    this.apply(moveCut(this.cuts(), index, this.player()?.currentMs() ?? this.playheadMs(), this.durationMs()));
  }

  protected onMoved(move: { index: number; ms: number }): void {
    this.apply(moveCut(this.cuts(), move.index, move.ms, this.durationMs()));
  }

  protected selectCut(index: number): void {
    this.selected.set(index);
    this.player()?.seekTo(this.cuts()[index]);
  }

  protected seek(ms: number): void {
    this.player()?.seekTo(ms);
  }

  protected async detectAgain(): Promise<void> {
    if (this.edited()) {
      const data: ConfirmDialogData = {
        title: 'Replace your cuts?',
        message: 'Detecting again replaces the cuts on the timeline, including the ones you added or moved.',
        confirmLabel: 'Detect again',
      };
      const go = await firstValueFrom(this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data }).afterClosed());
      if (!go) return;
    }
    this.problem.set(null);
    this.detecting.set(true);
    this.api.detectCuts(this.clipId(), this.threshold()).subscribe({
      next: () => this.restartPolling.next(),
      error: (failure: unknown) => {
        this.detecting.set(false);
        const error = readApiError(failure);
        this.problem.set(error.fields['threshold'] ?? error.message);
      },
    });
  }

  protected confirm(): void {
    const cutsMs = sortCuts(this.cuts());
    this.problem.set(null);
    this.splitting.set(true);
    this.api.splitTape(this.clipId(), cutsMs).subscribe({
      next: () => {
        this.notifier.info(`Cutting the tape into ${cutsMs.length + 1} snaps. They appear on the session page as they are processed.`);
        void this.router.navigate(['/film', this.sessionId()]);
      },
      error: (failure: unknown) => {
        this.splitting.set(false);
        const error = readApiError(failure);
        this.problem.set(error.fields['cutsMs'] ? `${error.message} ${error.fields['cutsMs']}` : error.message);
      },
    });
  }

  protected openHelp(): void {
    const data: ShortcutHelpData = { title: 'Cut Planner keys', groups: [CUT_SHORTCUTS, PLAYER_SHORTCUTS] };
    this.dialog.open(ShortcutHelpDialog, { data, width: '720px', maxWidth: '96vw' });
  }

  protected onKey(event: KeyboardEvent): void {
    if (!this.tape() || !isPageShortcut(event)) return;
    const cuts = this.cuts().length;
    const selected = this.selected();
    switch (event.key) {
      case 'c':
      case 'C':
        this.addCutHere();
        break;
      case 'Delete':
      case 'Backspace':
        this.removeSelected();
        break;
      case 'm':
      case 'M':
        this.moveSelectedHere();
        break;
      case ',':
        if (cuts > 0) this.selectCut(selected === null ? cuts - 1 : Math.max(0, selected - 1));
        break;
      case '.':
        if (cuts > 0) this.selectCut(selected === null ? 0 : Math.min(cuts - 1, selected + 1));
        break;
      case '?':
        this.openHelp();
        break;
      default:
        return;
    }
    event.preventDefault();
  }

  private apply(change: ReturnType<typeof addCut>, notice?: string): void {
    if ('error' in change) {
      this.problem.set(change.error);
      return;
    }
    this.cuts.set(change.cuts);
    this.selected.set(change.index);
    this.edited.set(true);
    this.problem.set(null);
    if (notice) this.notice.set(notice);
  }
}
