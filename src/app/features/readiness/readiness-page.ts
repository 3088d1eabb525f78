import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { AuthStore } from '../../core/auth/auth-store';
import { SafetyNote } from '../../core/feedback/safety-note';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { TeamStore } from '../../core/team/team-store';
import { PrintMode } from '../progress/print-mode';
import { formatRate, snapsText } from '../progress/rate-text';
import { ReportStyles, printableReport } from '../progress/report-styles';
import { SeasonPicker } from '../progress/season-picker';
import { seasonParams, seasonReady } from '../progress/season-ready';
import { cellMarks } from './cell-marks';
import { missedPivot } from './missed-pivot';
import { practicePriorities } from './practice-priorities';
import { ReadinessGrid } from './readiness-grid';
import type { LineDashboard, Readiness } from './readiness-types';
import { UnitGradeChart } from './unit-grade-chart';

const PRIORITIES_SHOWN = 10;

/** The line dashboard (unit grade, missed assignments) and the Readiness Grid with where practice reps should go. */
@Component({
  selector: 'tw-readiness-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, ReadinessGrid, ReportStyles, SafetyNote, SeasonPicker, StatePanel, UnitGradeChart],
  templateUrl: './readiness-page.html',
  styleUrl: './readiness-page.scss',
})
export class ReadinessPage {
  private readonly auth = inject(AuthStore);
  private readonly teams = inject(TeamStore);
  private readonly printMode = inject(PrintMode);
  protected readonly rate = formatRate;
  protected readonly snaps = snapsText;
  protected readonly marksOf = cellMarks;

  protected readonly seasonId = linkedSignal<number | null>(() => this.teams.currentSeason()?.id ?? null);
  private readonly request = (path: string) => {
    const teamId = this.auth.teamId();
    if (teamId === null || !seasonReady(this.teams)) return undefined;
    return { url: `/api/teams/${teamId}/${path}`, params: seasonParams(this.seasonId()), context: inlineErrors() };
  };
  protected readonly readiness = httpResource<Readiness>(() => this.request('readiness'));
  protected readonly dashboard = httpResource<LineDashboard>(() => this.request('line-dashboard'));

  protected readonly priorities = computed(() => (this.readiness.hasValue() ? practicePriorities(this.readiness.value()) : []));
  /** The top of the list is what a practice plan can use; the rest is a click away. */
  protected readonly showAll = signal(false);
  protected readonly shownPriorities = computed(() => (this.showAll() ? this.priorities() : this.priorities().slice(0, PRIORITIES_SHOWN)));
  protected readonly prioritiesShown = PRIORITIES_SHOWN;
  protected readonly missed = computed(() => missedPivot(this.dashboard.hasValue() ? this.dashboard.value().missedAssignments : []));

  constructor() {
    printableReport();
  }

  protected print(): void {
    this.printMode.print();
  }
}
