import { CdkDrag, CdkDragDrop, CdkDragHandle, CdkDropList, CdkDropListGroup } from '@angular/cdk/drag-drop';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { RouterLink } from '@angular/router';
import type { DepthChart } from '@shared/api/grading';
import type { Player, PlayerListResponse } from '@shared/api/roster';
import { chartWeekLabel, weeksGoverned } from '@shared/depth-chart';
import { POSITIONS, type Position } from '@shared/roster';
import { ROSTER_EDITOR_ROLES } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { Notifier } from '../../core/feedback/notifier';
import { StatePanel } from '../../core/feedback/state-panel';
import { readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { TeamStore } from '../../core/team/team-store';
import { PrintMode } from '../progress/print-mode';
import { ReportStyles, printableReport } from '../progress/report-styles';
import { SeasonPicker } from '../progress/season-picker';
import { seasonParams, seasonReady } from '../progress/season-ready';
import { ChangeHistory } from './change-history';
import { DepthChartApi } from './depth-chart-api';
import { addCandidate, changedPositions, draftFrom, MAX_PER_POSITION, removeCandidate, reorder, transfer, type ChartDraft, type EditResult } from './depth-chart-edits';
import type { ChartChange } from './describe-change';

/** The highest week a chart can be saved for (as for a film session's week). */
const MAX_CHART_WEEK = 25;

interface Person {
  name: string;
  jersey: number | null;
  positions: readonly string[];
  status?: Player['status'];
}

/**
 * The Depth Chart: ordered candidates at each spot, week by week (a week's chart carries forward until a
 * later week's); coordinators and admins drag to reorder, move or copy, and save with a reason.
 */
@Component({
  selector: 'tw-depth-chart-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    CdkDrag,
    CdkDragHandle,
    CdkDropList,
    CdkDropListGroup,
    ChangeHistory,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    ReportStyles,
    RouterLink,
    SeasonPicker,
    StatePanel,
  ],
  templateUrl: './depth-chart-page.html',
  styleUrl: './depth-chart-page.scss',
})
export class DepthChartPage {
  private readonly auth = inject(AuthStore);
  private readonly teams = inject(TeamStore);
  private readonly api = inject(DepthChartApi);
  private readonly notifier = inject(Notifier);
  private readonly printMode = inject(PrintMode);

  protected readonly positions = POSITIONS;
  protected readonly max = MAX_PER_POSITION;
  protected readonly canEdit = computed(() => ROSTER_EDITOR_ROLES.includes(this.auth.role() ?? 'player'));
  protected readonly mode = signal<'move' | 'copy'>('move');
  protected readonly reason = signal('');
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected readonly seasonId = linkedSignal<number | null>(() => this.teams.currentSeason()?.id ?? null);
  private readonly request = (path: string) => {
    const teamId = this.auth.teamId();
    if (teamId === null || !seasonReady(this.teams)) return undefined;
    return { url: `/api/teams/${teamId}/${path}`, params: seasonParams(this.seasonId()), context: inlineErrors() };
  };
  /** The week asked for; null: the current week (the latest saved). A new season starts at its current week. */
  protected readonly week = linkedSignal<number | null, number | null>({ source: this.seasonId, computation: () => null });
  protected readonly chart = httpResource<DepthChart>(() => {
    const base = this.request('depth-chart');
    const week = this.week();
    return base && week !== null ? { ...base, params: { ...base.params, week } } : base;
  });
  /** What the week picker needs, kept while another week loads so the picker stays put. */
  private readonly weeks = linkedSignal<DepthChart | null, Pick<DepthChart, 'week' | 'savedWeeks' | 'lastGameWeek'> | null>({
    source: () => (this.chart.hasValue() ? this.chart.value() : null),
    computation: (chart, previous) => (chart ? { week: chart.week, savedWeeks: chart.savedWeeks, lastGameWeek: chart.lastGameWeek } : (previous?.value ?? null)),
  });
  protected readonly shownWeek = computed(() => this.week() ?? this.weeks()?.week ?? null);
  /** Week 0 (the base chart) up to the week after the last game (or the last saved week, if later); saved weeks say so in words. */
  protected readonly weekOptions = computed(() => {
    const weeks = this.weeks();
    if (!weeks) return [];
    const last = Math.min(MAX_CHART_WEEK, Math.max((weeks.lastGameWeek ?? 0) + 1, weeks.week, ...weeks.savedWeeks));
    return Array.from({ length: last + 1 }, (_, week) => ({ week, label: `${chartWeekLabel(week)}${weeks.savedWeeks.includes(week) ? ' · own chart' : ''}` }));
  });
  /** Whose chart the week shows: its own, one carried from an earlier week, or none. */
  protected readonly weekStatus = computed(() => {
    if (!this.chart.hasValue()) return null;
    const { week, inForceFromWeek, savedWeeks } = this.chart.value();
    const span = weeksGoverned(savedWeeks, week);
    const inForce = span.through === null ? `from week ${week} on` : span.through === week ? `for week ${week} only` : `for weeks ${week}–${span.through}`;
    if (inForceFromWeek === null) return { lead: `No chart for week ${week}`, detail: 'Nothing is saved for it or an earlier week.', onSave: `Saving gives week ${week} its own chart, in force ${inForce}.` };
    if (inForceFromWeek !== week) return { lead: `Carried from week ${inForceFromWeek}`, detail: `Week ${week} has no chart of its own.`, onSave: `Saving gives week ${week} its own chart, in force ${inForce}.` };
    return { lead: `${chartWeekLabel(week)}'s own chart`, detail: `In force ${inForce}.`, onSave: null };
  });
  protected readonly saveWeekLabel = computed(() => {
    const week = this.shownWeek();
    return week === null ? null : chartWeekLabel(week);
  });
  protected pickWeek(event: Event): void {
    this.week.set(Number((event.target as HTMLSelectElement).value));
  }
  protected readonly roster = httpResource<PlayerListResponse>(() => this.request('players'));
  protected readonly history = httpResource<{ changes: ChartChange[] }>(() => this.request('depth-chart/history'));

  private readonly saved = computed<ChartDraft | null>(() => (this.chart.hasValue() ? draftFrom(this.chart.value().positions) : null));
  /** The chart as edited here; starts from (and returns to) what the server has. */
  protected readonly draft = linkedSignal<ChartDraft | null>(() => this.saved());
  protected readonly changed = computed(() => {
    const saved = this.saved();
    const draft = this.draft();
    return saved && draft ? changedPositions(saved, draft) : {};
  });
  protected readonly changedList = computed(() => Object.keys(this.changed()) as Position[]);

  private readonly people = computed(() => {
    const map = new Map<number, Person>();
    if (this.roster.hasValue()) for (const p of this.roster.value().players) map.set(p.id, { name: p.name, jersey: p.jersey, positions: p.positions, status: p.status });
    if (this.chart.hasValue()) {
      for (const list of Object.values(this.chart.value().positions)) for (const c of list) if (!map.has(c.playerId)) map.set(c.playerId, { name: c.name, jersey: c.jersey, positions: [] });
    }
    return map;
  });
  protected readonly nameOf = (id: number): string => this.people().get(id)?.name ?? `Player ${id}`;
  protected readonly labelOf = (id: number): string => {
    const p = this.people().get(id);
    if (!p) return `Player ${id}`;
    return `${p.jersey !== null ? `#${p.jersey} ` : ''}${p.name}${p.status === 'injured' ? ' (injured)' : ''}`;
  };

  /** Roster players not yet at a position; those who list it on the roster first. */
  protected addable(position: Position): { plays: Player[]; others: Player[] } {
    const draft = this.draft();
    const players = this.roster.hasValue() ? this.roster.value().players.filter((p) => p.status !== 'inactive' && !draft?.[position].includes(p.id)) : [];
    const sorted = [...players].sort((a, b) => a.jersey - b.jersey);
    return { plays: sorted.filter((p) => p.positions.includes(position)), others: sorted.filter((p) => !p.positions.includes(position)) };
  }

  /** A swing player listed elsewhere too: "also at RG, RT". */
  protected versatility(id: number, position: Position): string {
    const draft = this.draft();
    const elsewhere = draft ? POSITIONS.filter((p) => p !== position && draft[p].includes(id)) : [];
    return elsewhere.length > 0 ? `also at ${elsewhere.join(', ')}` : '';
  }

  protected compareLink(position: Position): string | null {
    const ids = this.draft()?.[position] ?? [];
    return ids.length >= 2 ? ids.slice(0, 4).join(',') : null;
  }

  /** "Starter", then "2nd", "3rd", "4th"… */
  protected rankLabel(index: number): string {
    if (index === 0) return 'Starter';
    const n = index + 1;
    const suffix = n % 100 >= 11 && n % 100 <= 13 ? 'th' : (['th', 'st', 'nd', 'rd'][n % 10] ?? 'th');
    return `${n}${suffix}`;
  }

  constructor() {
    printableReport();
  }

  protected drop(event: CdkDragDrop<Position>): void {
    const from = event.previousContainer.data;
    const to = event.container.data;
    if (from === to) {
      if (event.previousIndex !== event.currentIndex) this.edit((d) => ({ ok: true, draft: reorder(d, to, event.previousIndex, event.currentIndex) }));
      return;
    }
    const id = this.draft()?.[from][event.previousIndex];
    this.edit((d) => transfer(d, from, event.previousIndex, to, event.currentIndex, this.mode(), id === undefined ? undefined : this.nameOf(id)));
  }

  protected moveBy(position: Position, index: number, step: number): void {
    this.edit((d) => ({ ok: true, draft: reorder(d, position, index, index + step) }));
  }

  protected sendTo(from: Position, index: number, to: Position, mode: 'move' | 'copy'): void {
    const id = this.draft()?.[from][index];
    this.edit((d) => transfer(d, from, index, to, d[to].length, mode, id === undefined ? undefined : this.nameOf(id)));
  }

  protected remove(position: Position, index: number): void {
    this.edit((d) => ({ ok: true, draft: removeCandidate(d, position, index) }));
  }

  protected add(position: Position, event: Event): void {
    const select = event.target as HTMLSelectElement;
    const id = Number(select.value);
    select.value = '';
    if (!id) return;
    this.edit((d) => addCandidate(d, position, id, this.nameOf(id)));
  }

  protected discard(): void {
    this.draft.set(this.saved());
    this.problem.set(null);
  }

  protected save(): void {
    const teamId = this.auth.teamId();
    const reason = this.reason().trim();
    if (teamId === null || this.changedList().length === 0) return;
    if (!reason) {
      this.problem.set('Say why the chart changes: the reason is kept in the history.');
      return;
    }
    const seasonId = this.chart.hasValue() ? this.chart.value().seasonId : this.seasonId();
    const week = this.shownWeek();
    this.saving.set(true);
    this.problem.set(null);
    this.api.save(teamId, { ...(seasonId !== null ? { seasonId } : {}), ...(week !== null ? { week } : {}), positions: this.changed(), reason }).subscribe({
      next: (chart) => {
        this.saving.set(false);
        this.reason.set('');
        this.chart.set(chart);
        this.history.reload();
        this.notifier.info('Depth chart saved.');
      },
      error: (failure: unknown) => {
        this.saving.set(false);
        const error = readApiError(failure);
        this.problem.set(Object.values(error.fields)[0] ?? error.message);
      },
    });
  }

  protected print(): void {
    this.printMode.print();
  }

  private edit(change: (draft: ChartDraft) => EditResult): void {
    const draft = this.draft();
    if (!draft || !this.canEdit()) return;
    const result = change(draft);
    if (result.ok) {
      this.draft.set(result.draft);
      this.problem.set(null);
    } else {
      this.problem.set(result.problem);
    }
  }
}
