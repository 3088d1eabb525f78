import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, numberAttribute, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { forkJoin, map, of, switchMap } from 'rxjs';
import type { FilmSession } from '@shared/api/film';
import type { GradingProgress } from '@shared/api/grading';
import { AuthStore } from '../../core/auth/auth-store';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { TeamStore } from '../../core/team/team-store';
import { COMPONENT_NAMES, DEVELOPMENT_COMPONENTS, type DevelopmentComponent } from '../progress/development-types';
import { PrintMode } from '../progress/print-mode';
import { formatRate, snapsText } from '../progress/rate-text';
import { ReportStyles, printableReport } from '../progress/report-styles';
import { SeasonPicker } from '../progress/season-picker';
import { seasonParams, seasonReady } from '../progress/season-ready';
import type { Agreement } from './agreement-types';
import { gradersFrom } from './grader-list';
import { formatKappa, KAPPA_BANDS, KAPPA_FEW_SNAPS, KAPPA_SOURCE, kappaBand } from './kappa-bands';

/** The newest sessions looked at for graders: enough for a season, without a request per old practice. */
const SESSIONS_FOR_GRADERS = 40;
const PAGE = 50;

const optionalId = (v: unknown) => (v === undefined || v === null || v === '' ? null : numberAttribute(v, 0) || null);

const MARKS: Record<string, string | undefined> = { plus: '+ plus', minus: '− minus', right: '✓ right', missed: '✗ missed', loaf: '✗ loaf' };

/** Calibration: how closely two graders agree per part of the grade (Cohen's kappa), and where they disagreed. */
@Component({
  selector: 'tw-calibration-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule, ReportStyles, RouterLink, SeasonPicker, StatePanel],
  templateUrl: './calibration-page.html',
  styleUrl: './calibration-page.scss',
})
export class CalibrationPage {
  readonly graderA = input<number | null, unknown>(null, { transform: optionalId });
  readonly graderB = input<number | null, unknown>(null, { transform: optionalId });

  private readonly auth = inject(AuthStore);
  private readonly teams = inject(TeamStore);
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private readonly printMode = inject(PrintMode);

  protected readonly bands = KAPPA_BANDS;
  protected readonly source = KAPPA_SOURCE;
  protected readonly fewSnaps = KAPPA_FEW_SNAPS;
  protected readonly kappa = formatKappa;
  protected readonly band = kappaBand;
  protected readonly rate = formatRate;
  protected readonly snaps = snapsText;
  protected readonly parts = DEVELOPMENT_COMPONENTS;
  protected readonly partNames = COMPONENT_NAMES;
  protected readonly marks = MARKS;
  /** Unknown part keys (a scheme's own parts) show as sent. */
  protected readonly partLabel = (key: string) => (COMPONENT_NAMES as Record<string, string | undefined>)[key] ?? key;

  protected readonly seasonId = linkedSignal<number | null>(() => this.teams.currentSeason()?.id ?? null);
  protected readonly pickedA = linkedSignal(() => this.graderA());
  protected readonly pickedB = linkedSignal(() => this.graderB());

  /** Everyone who graded this season's sessions, from each session's grading progress (coaches cannot list the staff). */
  protected readonly graders = rxResource({
    params: () => {
      const teamId = this.auth.teamId();
      return teamId === null || !seasonReady(this.teams) ? undefined : { teamId, season: seasonParams(this.seasonId()) };
    },
    stream: ({ params }) =>
      this.http.get<{ sessions: FilmSession[] }>('/api/film-sessions', { params: { teamId: params.teamId, ...params.season }, context: inlineErrors() }).pipe(
        switchMap((r) => {
          const sessions = [...r.sessions]
            .filter((s) => s.snapCount > 0)
            .sort((a, b) => (a.date < b.date ? 1 : a.date > b.date ? -1 : 0))
            .slice(0, SESSIONS_FOR_GRADERS);
          // forkJoin of nothing completes without a value: a season without film has no graders.
          if (sessions.length === 0) return of([] as GradingProgress[]);
          return forkJoin(sessions.map((s) => this.http.get<GradingProgress>(`/api/film-sessions/${s.id}/grading-progress`, { context: inlineErrors() })));
        }),
        map((progress) => gradersFrom(progress)),
      ),
  });
  protected readonly graderList = computed(() => (this.graders.hasValue() ? (this.graders.value() ?? []) : []));
  protected readonly nameOf = computed(() => new Map(this.graderList().map((g) => [g.graderId, g.name])));

  protected readonly agreement = httpResource<Agreement>(() => {
    const teamId = this.auth.teamId();
    const a = this.graderA();
    const b = this.graderB();
    if (teamId === null || a === null || b === null || a === b || !seasonReady(this.teams)) return undefined;
    return { url: `/api/teams/${teamId}/agreement`, params: { graderA: a, graderB: b, ...seasonParams(this.seasonId()) }, context: inlineErrors() };
  });

  protected readonly filter = signal<DevelopmentComponent | 'all'>('all');
  protected readonly shown = signal(PAGE);

  protected readonly rows = computed(() => {
    if (!this.agreement.hasValue()) return [];
    const components = this.agreement.value().components;
    return this.parts.map((part) => {
      const c = components[part] ?? { snaps: 0, kappa: null, observed: null, expected: null, note: 'no snaps compared' as const };
      return { part, ...c, band: c.kappa === null ? null : kappaBand(c.kappa) };
    });
  });

  protected readonly disagreements = computed(() => {
    const list = this.agreement.hasValue() ? this.agreement.value().disagreements : [];
    const only = this.filter();
    return only === 'all' ? list : list.filter((d) => d.component === only);
  });

  constructor() {
    printableReport();
  }

  protected noteText(note: string | null): string {
    if (note === 'no snaps compared') return 'No snap that both graded: nothing to compare.';
    if (note === 'one label only') return 'Both gave every snap the same mark, so chance explains all the agreement and kappa cannot be computed.';
    return '';
  }

  protected compare(): void {
    const a = this.pickedA();
    const b = this.pickedB();
    void this.router.navigate([], { queryParams: { graderA: a, graderB: b }, queryParamsHandling: 'merge' });
    this.shown.set(PAGE);
  }

  protected setFilter(value: DevelopmentComponent | 'all'): void {
    this.filter.set(value);
    this.shown.set(PAGE);
  }

  protected more(): void {
    this.shown.update((n) => n + PAGE);
  }

  protected print(): void {
    this.printMode.print();
  }
}
