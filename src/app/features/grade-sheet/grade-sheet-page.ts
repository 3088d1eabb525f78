import { DOCUMENT } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, numberAttribute, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { FilmSession } from '@shared/api/film';
import type { GradeSheet, GradeSheetPlayer, Scheme } from '@shared/api/grading';
import { GRADING_ROLES } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { ConfirmDialog, ConfirmDialogData } from '../../core/feedback/confirm-dialog';
import { Notifier } from '../../core/feedback/notifier';
import { StatePanel } from '../../core/feedback/state-panel';
import { readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { GradeSheetApi } from './grade-sheet-api';
import { PlayerSheetCard } from './player-sheet-card';
import { SheetPrintStyles } from './sheet-print-styles';
import { formatRate } from './sheet-format';
import { UnitSheet } from './unit-sheet';

type View = 'players' | 'unit';

/** The Grade Sheet of one session: each lineman's numbers and the whole line's, printable. */
@Component({
  selector: 'tw-grade-sheet-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, PlayerSheetCard, RouterLink, SheetPrintStyles, StatePanel, UnitSheet],
  templateUrl: './grade-sheet-page.html',
  styleUrl: './grade-sheet-page.scss',
})
export class GradeSheetPage {
  readonly sessionId = input.required({ transform: numberAttribute });

  private readonly auth = inject(AuthStore);
  private readonly api = inject(GradeSheetApi);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);

  protected readonly session = httpResource<FilmSession>(() => ({ url: `/api/film-sessions/${this.sessionId()}`, context: inlineErrors() }));
  protected readonly sheet = httpResource<GradeSheet>(() => ({ url: `/api/film-sessions/${this.sessionId()}/grade-sheet`, context: inlineErrors() }));
  /** Only for the names of the team's extra parts. */
  private readonly scheme = httpResource<Scheme>(() => {
    const teamId = this.session.hasValue() ? this.session.value().teamId : null;
    return teamId === null ? undefined : { url: `/api/teams/${teamId}/grading-scheme`, context: inlineErrors() };
  });

  protected readonly view = signal<View>('players');
  protected readonly only = signal<number | null>(null);
  protected readonly pagePerPlayer = signal(false);
  protected readonly mailing = signal<ReadonlySet<number>>(new Set());
  protected readonly rate = formatRate;

  protected readonly canMail = computed(() => GRADING_ROLES.includes(this.auth.role() ?? 'player'));
  protected readonly csvUrl = computed(() => this.api.csvUrl(this.sessionId()));
  protected readonly extraLabels = computed(() => new Map((this.scheme.hasValue() ? this.scheme.value().extraComponents : []).map((c) => [c.key, c.label])));
  protected readonly players = computed(() => {
    const list = this.sheet.hasValue() ? [...this.sheet.value().players] : [];
    list.sort((a, b) => (a.jersey ?? 100) - (b.jersey ?? 100) || a.name.localeCompare(b.name));
    const only = this.only();
    return only === null ? list : list.filter((p) => p.playerId === only);
  });
  protected readonly allPlayers = computed(() => (this.sheet.hasValue() ? this.sheet.value().players : []));

  constructor() {
    // The print stylesheet acts only while this page is open.
    const body = inject(DOCUMENT).body;
    body.classList.add('tw-printing-sheet');
    inject(DestroyRef).onDestroy(() => body.classList.remove('tw-printing-sheet'));
  }

  protected choose(event: Event): void {
    const value = (event.target as HTMLSelectElement).value;
    this.only.set(value === '' ? null : Number(value));
  }

  protected print(): void {
    window.print();
  }

  protected mail(player: GradeSheetPlayer): void {
    const data: ConfirmDialogData = {
      title: `Mail the grade sheet to ${player.name}?`,
      message: `${player.name} gets his own numbers and coaching points for this session by e-mail. Nobody else's grades are in it.`,
      confirmLabel: 'Send it',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .subscribe((yes) => {
        if (!yes) return;
        this.mailing.update((set) => new Set(set).add(player.playerId));
        const done = () => this.mailing.update((set) => new Set([...set].filter((id) => id !== player.playerId)));
        this.api.mail(this.sessionId(), player.playerId).subscribe({
          next: () => {
            done();
            this.notifier.info(`The grade sheet is on its way to ${player.name}.`);
          },
          error: (failure: unknown) => {
            done();
            this.notifier.error(`Not sent to ${player.name}: ${readApiError(failure).message}`);
          },
        });
      });
  }
}
