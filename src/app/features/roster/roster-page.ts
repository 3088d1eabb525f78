import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorIntl, MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { Player, PlayerListResponse } from '@shared/api/roster';
import { CLASS_YEAR_LABELS, formatHeight } from '@shared/roster';
import { ROSTER_EDITOR_ROLES } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { Notifier } from '../../core/feedback/notifier';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { TeamStore } from '../../core/team/team-store';
import { ImportReport } from './import-report';
import { PlayerDialog, PlayerDialogData } from './player-dialog';
import { RosterApi } from './roster-api';
import { RosterPaginatorIntl } from './roster-paginator-intl';
import { ImportOutcome, RosterImport } from './roster-import';
import { sortPlayers, visiblePlayers } from './roster-rows';
import { STATUS_ICONS, STATUS_LABELS } from './status-labels';

const COLUMNS = ['jersey', 'name', 'positions', 'class', 'height', 'weight', 'status', 'account'];

/** The season's roster for staff; admins and coordinators edit it, the rest of the staff reads it. */
@Component({
  selector: 'tw-roster-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ImportReport,
    MatButtonModule,
    MatChipsModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatSelectModule,
    MatSlideToggleModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
    RosterImport,
    StatePanel,
  ],
  providers: [{ provide: MatPaginatorIntl, useClass: RosterPaginatorIntl }],
  templateUrl: './roster-page.html',
  styleUrl: './roster-page.scss',
})
export class RosterPage {
  private readonly auth = inject(AuthStore);
  protected readonly teams = inject(TeamStore);
  private readonly api = inject(RosterApi);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);

  protected readonly formatHeight = formatHeight;
  // Widened for the table's untyped row context.
  protected readonly classLabels: Record<string, string> = CLASS_YEAR_LABELS;
  protected readonly statusLabels: Record<string, string> = STATUS_LABELS;
  protected readonly statusIcons: Record<string, string> = STATUS_ICONS;

  protected readonly teamId = this.auth.teamId;
  protected readonly canEdit = computed(() => {
    const role = this.auth.role();
    return role !== null && ROSTER_EDITOR_ROLES.includes(role);
  });
  protected readonly columns = computed(() => (this.canEdit() ? [...COLUMNS, 'actions'] : COLUMNS));

  /** Starts at the current season and follows the team; the selector changes it. */
  protected readonly seasonId = linkedSignal<number | null>(() => this.teams.currentSeason()?.id ?? null);

  protected readonly roster = httpResource<PlayerListResponse>(() => {
    const teamId = this.teamId();
    // Wait for the team so the first request already asks for the right season.
    if (teamId === null || !this.teams.team.hasValue()) return undefined;
    const seasonId = this.seasonId();
    const params: Record<string, number> = seasonId === null ? {} : { seasonId };
    return { url: `/api/teams/${teamId}/players`, params, context: inlineErrors() };
  });

  /** The season the list really is for (the server picks one when we do not). */
  protected readonly listedSeasonId = computed(() => (this.roster.hasValue() ? this.roster.value().seasonId : this.seasonId()));
  protected readonly exportUrl = computed(() => {
    const teamId = this.teamId();
    return teamId === null ? null : this.api.exportUrl(teamId, this.listedSeasonId());
  });

  protected readonly filter = signal('');
  protected readonly showInactive = signal(false);
  protected readonly sort = signal<Sort>({ active: 'jersey', direction: 'asc' });
  protected readonly pageSize = signal(25);
  /** Back to the first page whenever the rows change shape. */
  protected readonly pageIndex = linkedSignal({
    source: () => [this.filter(), this.showInactive(), this.sort(), this.seasonId()],
    computation: () => 0,
  });

  private readonly players = computed<Player[]>(() => (this.roster.hasValue() ? this.roster.value().players : []));
  protected readonly inactiveCount = computed(() => this.players().filter((p) => p.status === 'inactive').length);
  protected readonly matching = computed(() => sortPlayers(visiblePlayers(this.players(), this.filter(), this.showInactive()), this.sort()));
  protected readonly pageRows = computed(() => {
    const start = this.pageIndex() * this.pageSize();
    return this.matching().slice(start, start + this.pageSize());
  });

  protected readonly importOutcome = signal<ImportOutcome | null>(null);
  protected readonly trackById = (_index: number, player: Player) => player.id;

  protected onPage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }

  protected onImported(outcome: ImportOutcome): void {
    this.importOutcome.set(outcome);
    if (outcome.kind === 'imported') this.roster.reload();
  }

  protected openEditor(player: Player | null): void {
    const teamId = this.teamId();
    if (teamId === null) return;
    const data: PlayerDialogData = { teamId, seasonId: this.listedSeasonId(), player };
    this.dialog
      .open<PlayerDialog, PlayerDialogData, Player>(PlayerDialog, { data, width: '560px', maxWidth: '96vw', autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.notifier.info(player ? `Saved #${saved.jersey} ${saved.name}.` : `Added #${saved.jersey} ${saved.name} to the roster.`);
        this.roster.reload();
      });
  }

  /** Nothing is deleted: an entry leaves the list by becoming inactive, and can come back. */
  protected setActive(player: Player, active: boolean): void {
    const teamId = this.teamId();
    if (teamId === null) return;
    this.api.update(teamId, player.id, { status: active ? 'active' : 'inactive' }, false).subscribe(() => {
      this.notifier.info(
        active
          ? `#${player.jersey} ${player.name} is active again.`
          : `#${player.jersey} ${player.name} is now inactive and hidden unless "Show inactive" is on.`,
      );
      this.roster.reload();
    });
  }
}
