import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, numberAttribute, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { GRADING_ROLES, STAFF_ROLES } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { TeamStore } from '../../core/team/team-store';
import { COMPONENT_NAMES, DEVELOPMENT_COMPONENTS, SPLIT_KINDS, SPLIT_NAMES, type Development, type GoalComponent, type RateShape, type SplitKind, type SplitRow } from './development-types';
import { GoalsPanel } from './goals-panel';
import { NotesPanel } from './notes-panel';
import { PrintMode } from './print-mode';
import { formatInterval, formatRate, formatSlope, formatSlopeInterval, rateSentence, readingView, snapsText, trendRuleText } from './rate-text';
import { ReportStyles, printableReport } from './report-styles';
import { SeasonPicker } from './season-picker';
import { SessionTable } from './session-table';
import { seasonParams, seasonReady } from './season-ready';
import { SplitChart } from './split-chart';
import { TrendChart } from './trend-chart';
import type { TrendPoint } from './trend-series';

/** A player's Progress: trends per part of the grade, the reading in words, splits, goals and coach notes. */
@Component({
  selector: 'tw-progress-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [GoalsPanel, MatButtonModule, MatButtonToggleModule, MatIconModule, NotesPanel, ReportStyles, RouterLink, SeasonPicker, SessionTable, SplitChart, StatePanel, TrendChart],
  templateUrl: './progress-page.html',
  styleUrl: './progress-page.scss',
})
export class ProgressPage {
  readonly playerId = input.required({ transform: numberAttribute });

  private readonly auth = inject(AuthStore);
  private readonly teams = inject(TeamStore);
  private readonly printMode = inject(PrintMode);

  protected readonly rate = formatRate;
  protected readonly range = formatInterval;
  protected readonly snaps = snapsText;
  protected readonly sentence = rateSentence;
  protected readonly splitKinds = SPLIT_KINDS;
  protected readonly splitNames = SPLIT_NAMES;
  protected readonly ruleText = trendRuleText();

  protected readonly isStaff = computed(() => STAFF_ROLES.includes(this.auth.role() ?? 'player'));
  protected readonly canEdit = computed(() => GRADING_ROLES.includes(this.auth.role() ?? 'player'));

  protected readonly seasonId = linkedSignal<number | null>(() => this.teams.currentSeason()?.id ?? null);
  protected readonly development = httpResource<Development>(() => {
    if (!seasonReady(this.teams)) return undefined;
    return { url: `/api/players/${this.playerId()}/development`, params: seasonParams(this.seasonId()), context: inlineErrors() };
  });

  private readonly data = computed(() => (this.development.hasValue() ? this.development.value() : null));
  protected readonly split = signal<SplitKind>('concept');

  protected readonly reading = computed(() => {
    const d = this.data();
    return d ? readingView(d.trend.reading) : null;
  });
  protected readonly slopeText = computed(() => {
    const t = this.data()?.trend;
    if (!t || t.slopePerWeek === null) return null;
    return `${formatSlope(t.slopePerWeek)} (95 % interval ${formatSlopeInterval(t.slopeInterval)} points) over ${snapsText(t.weeks, 'graded week')}`;
  });

  /** Overall first, then each part of the grade, each with its own sessions and rolling rate. */
  protected readonly trends = computed<{ key: string; heading: string; points: TrendPoint[]; total: RateShape }[]>(() => {
    const d = this.data();
    if (!d) return [];
    const overall = { key: 'overall', heading: 'Overall grade', total: d.overall, points: d.sessions.map((s) => ({ ...s })) };
    const titles = new Map(d.sessions.map((s) => [s.sessionId, s.title]));
    const parts = DEVELOPMENT_COMPONENTS.map((c) => {
      const trend = d.componentTrends[c];
      return {
        key: c,
        heading: COMPONENT_NAMES[c],
        total: d.components[c],
        points: (trend?.sessions ?? []).map((s, i) => ({ ...s, title: titles.get(s.sessionId), rolling: trend.rolling[i] ?? null })),
      };
    });
    return [overall, ...parts];
  });

  protected readonly goalRates = computed(() => {
    const d = this.data();
    return d ? ({ overall: d.overall, ...d.components } as Record<GoalComponent, RateShape>) : null;
  });

  protected readonly splitRows = computed<SplitRow[]>(() => this.data()?.splits[this.split()] ?? []);

  protected meetsLine(r: RateShape, threshold: number): { symbol: string; text: string } {
    if (r.rate === null) return { symbol: '—', text: 'no graded snaps yet' };
    return r.rate >= threshold ? { symbol: '✓', text: `at or above the winning grade (${formatRate(threshold)})` } : { symbol: '✗', text: `below the winning grade (${formatRate(threshold)})` };
  }

  constructor() {
    printableReport();
  }

  protected print(): void {
    this.printMode.print();
  }
}
