import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import type { FilmSession } from '@shared/api/film';
import { SESSION_KINDS, type SessionKind } from '@shared/film';
import { AuthStore } from '../../core/auth/auth-store';
import { Notifier } from '../../core/feedback/notifier';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { TeamStore } from '../../core/team/team-store';
import { ClipCounts } from './clip-counts';
import { SESSION_KIND_ICONS, SESSION_KIND_LABELS } from './clip-states';
import { NewSessionDialog, NewSessionData } from './new-session-dialog';
import { opponentLine } from './session-title';

type KindFilter = SessionKind | 'all';

/** Film Library: a season's games, scrimmages and practices, newest first, with their film state. */
@Component({
  selector: 'tw-film-library-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ClipCounts, DatePipe, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatSelectModule, RouterLink, StatePanel],
  templateUrl: './film-library-page.html',
  styleUrl: './film-library-page.scss',
})
export class FilmLibraryPage {
  private readonly auth = inject(AuthStore);
  protected readonly teams = inject(TeamStore);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly notifier = inject(Notifier);

  protected readonly kinds = SESSION_KINDS;
  protected readonly kindLabels = SESSION_KIND_LABELS;
  protected readonly kindIcons = SESSION_KIND_ICONS;
  protected readonly opponentLine = opponentLine;

  /** Starts at the current season and follows the team; the selector changes it. */
  protected readonly seasonId = linkedSignal<number | null>(() => this.teams.currentSeason()?.id ?? null);
  protected readonly kind = signal<KindFilter>('all');

  protected readonly library = httpResource<{ sessions: FilmSession[]; seasonId: number }>(() => {
    const teamId = this.auth.teamId();
    // Wait for the team so the first request already asks for the right season.
    if (teamId === null || !this.teams.team.hasValue()) return undefined;
    const seasonId = this.seasonId();
    const kind = this.kind();
    const params: Record<string, string | number> = { teamId };
    if (seasonId !== null) params['seasonId'] = seasonId;
    if (kind !== 'all') params['kind'] = kind;
    return { url: '/api/film-sessions', params, context: inlineErrors() };
  });

  protected readonly sessions = computed(() => {
    const list = this.library.hasValue() ? this.library.value().sessions : [];
    return [...list].sort((a, b) => (a.date === b.date ? b.id - a.id : a.date < b.date ? 1 : -1));
  });

  protected readonly emptyMessage = computed(() =>
    this.kind() === 'all'
      ? 'No film sessions in this season yet. Add a game, scrimmage or practice, then upload its film.'
      : `No ${this.kindLabels[this.kind() as SessionKind].toLowerCase()} sessions in this season.`,
  );

  protected openNew(): void {
    const teamId = this.auth.teamId();
    if (teamId === null) return;
    const listed = this.library.hasValue() ? this.library.value().seasonId : this.seasonId();
    const kind = this.kind();
    const data: NewSessionData = { teamId, seasonId: listed, kind: kind === 'all' ? 'game' : kind };
    this.dialog
      .open<NewSessionDialog, NewSessionData, FilmSession>(NewSessionDialog, { data, width: '600px', maxWidth: '96vw', autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((session) => {
        if (!session) return;
        this.notifier.info(`Added “${session.title}”. Upload its film here.`);
        void this.router.navigate(['/film', session.id]);
      });
  }
}
