import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';
import { forkJoin } from 'rxjs';
import type { DepthChart } from '@shared/api/grading';
import type { PlayerListResponse } from '@shared/api/roster';
import { POSITIONS, type Position } from '@shared/roster';
import { MIN_SNAPS_TO_COMPARE } from '@shared/stats';
import { AuthStore } from '../../core/auth/auth-store';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { TeamStore } from '../../core/team/team-store';
import { COMPONENT_NAMES, DEVELOPMENT_COMPONENTS, type Development } from '../progress/development-types';
import { PrintMode } from '../progress/print-mode';
import { formatInterval, formatRate, snapsText } from '../progress/rate-text';
import { ReportStyles, printableReport } from '../progress/report-styles';
import { SeasonPicker } from '../progress/season-picker';
import { seasonParams, seasonReady } from '../progress/season-ready';
import { parsePlayerIds, splitComparison } from './battle-rows';
import type { Comparison } from './comparison-types';
import { IntervalPlot } from './interval-plot';
import { Sparkline } from './sparkline';

/** Position Battle: two to four candidates side by side, with intervals and the plain reading of each pair. */
@Component({
  selector: 'tw-position-battle-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [IntervalPlot, MatButtonModule, MatIconModule, ReportStyles, RouterLink, SeasonPicker, Sparkline, StatePanel],
  templateUrl: './position-battle-page.html',
  styleUrl: './position-battle-page.scss',
})
export class PositionBattlePage {
  /** `?players=12,22`, bound by the router. */
  readonly players = input<string | undefined>();

  private readonly auth = inject(AuthStore);
  private readonly teams = inject(TeamStore);
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private readonly printMode = inject(PrintMode);

  protected readonly rate = formatRate;
  protected readonly range = formatInterval;
  protected readonly snaps = snapsText;
  protected readonly positions = POSITIONS;
  protected readonly componentKeys = DEVELOPMENT_COMPONENTS;
  protected readonly componentNames = COMPONENT_NAMES;
  protected readonly minSnaps = MIN_SNAPS_TO_COMPARE;

  protected readonly ids = computed(() => parsePlayerIds(this.players()));
  /** The players ticked in the chooser; follows the address, changes before "Compare". */
  protected readonly picked = linkedSignal<number[]>(() => this.ids());

  protected readonly seasonId = linkedSignal<number | null>(() => this.teams.currentSeason()?.id ?? null);
  private readonly teamRequest = (path: string) => {
    const teamId = this.auth.teamId();
    if (teamId === null || !seasonReady(this.teams)) return undefined;
    return { url: `/api/teams/${teamId}/${path}`, params: seasonParams(this.seasonId()), context: inlineErrors() };
  };
  protected readonly roster = httpResource<PlayerListResponse>(() => this.teamRequest('players'));
  protected readonly chart = httpResource<DepthChart>(() => this.teamRequest('depth-chart'));

  protected readonly comparison = httpResource<Comparison>(() => {
    const ids = this.ids();
    if (ids.length < 2 || !seasonReady(this.teams)) return undefined;
    return { url: '/api/comparisons', params: { players: ids.join(','), ...seasonParams(this.seasonId()) }, context: inlineErrors() };
  });

  /** Each player's development answer, for the concept and front splits and the winning grade. */
  protected readonly developments = rxResource({
    params: () => {
      const ids = this.ids();
      return ids.length < 2 || !seasonReady(this.teams) ? undefined : { ids, season: seasonParams(this.seasonId()) };
    },
    stream: ({ params }) => forkJoin(params.ids.map((id) => this.http.get<Development>(`/api/players/${id}/development`, { params: params.season, context: inlineErrors() }))),
  });

  protected readonly threshold = computed(() => (this.developments.hasValue() ? (this.developments.value()?.[0]?.winningThreshold ?? null) : null));
  protected readonly compared = computed(() => (this.comparison.hasValue() ? this.comparison.value().players : []));
  protected readonly nameOf = computed(() => new Map(this.compared().map((p) => [p.playerId, p.name])));
  protected readonly plotRows = computed(() => this.compared().map((p) => ({ label: p.name, rate: p.rate, interval: p.interval, snaps: p.snaps })));
  protected readonly conceptRows = computed(() => this.splitRows('concept'));
  protected readonly frontRows = computed(() => this.splitRows('front'));

  protected readonly rosterPlayers = computed(() => (this.roster.hasValue() ? [...this.roster.value().players].filter((p) => p.status !== 'inactive').sort((a, b) => a.jersey - b.jersey) : []));
  protected readonly candidatesAt = computed(() => {
    const positions = this.chart.hasValue() ? this.chart.value().positions : {};
    return POSITIONS.map((p) => ({ position: p, candidates: positions[p] ?? [] })).filter((c) => c.candidates.length >= 2);
  });

  /** Versatility: the positions he was graded at, most snaps first ("LG 120 snaps, LT 14 snaps"). */
  protected positionsPlayed(record: Record<string, number>): { count: number; text: string } {
    const list = Object.entries(record).sort((a, b) => b[1] - a[1]);
    return { count: list.length, text: list.map(([position, n]) => `${position} ${snapsText(n)}`).join(', ') };
  }

  protected toggle(id: number, on: boolean): void {
    this.picked.update((list) => (on ? (list.includes(id) || list.length >= 4 ? list : [...list, id]) : list.filter((x) => x !== id)));
  }

  protected pickPosition(position: Position): void {
    const list = this.chart.hasValue() ? (this.chart.value().positions[position] ?? []) : [];
    this.go(list.slice(0, 4).map((c) => c.playerId));
  }

  protected compare(): void {
    this.go(this.picked());
  }

  private go(ids: number[]): void {
    void this.router.navigate([], { queryParams: { players: ids.length > 0 ? ids.join(',') : null }, queryParamsHandling: 'merge' });
  }

  constructor() {
    printableReport();
  }

  protected print(): void {
    this.printMode.print();
  }

  private splitRows(kind: 'concept' | 'front') {
    const list = this.developments.hasValue() ? (this.developments.value() ?? []) : [];
    if (list.length === 0) return [];
    return splitComparison(list.map((d) => d.splits[kind] ?? []));
  }
}
