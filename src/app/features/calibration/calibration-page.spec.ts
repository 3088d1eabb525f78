import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { GradingProgress } from '@shared/api/grading';
import { cohensKappa } from '@shared/stats';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { filmSession } from '../film-library/film-test-data';
import { TEAM } from '../progress/development-test-data';
import type { Agreement } from './agreement-types';
import { CalibrationPage } from './calibration-page';

// Footwork on 40 snaps: both plus on 30, both minus on 7, 2 plus/minus, 1 minus/plus.
const footworkPairs: [string, string][] = [
  ...Array.from({ length: 30 }, () => ['plus', 'plus'] as [string, string]),
  ...Array.from({ length: 7 }, () => ['minus', 'minus'] as [string, string]),
  ...Array.from({ length: 2 }, () => ['plus', 'minus'] as [string, string]),
  ...Array.from({ length: 1 }, () => ['minus', 'plus'] as [string, string]),
];
const footwork = cohensKappa(footworkPairs);
const handsPairs: [string, string][] = [['plus', 'plus'], ['plus', 'minus'], ['minus', 'plus'], ['plus', 'plus'], ['minus', 'minus'], ['plus', 'minus']];
const hands = cohensKappa(handsPairs);
const none = { snaps: 0, kappa: null, observed: null, expected: null, note: 'no snaps compared' as const };

const AGREEMENT: Agreement = {
  graderA: 7,
  graderB: 9,
  components: {
    assignment: { snaps: 40, kappa: null, observed: 1, expected: 1, note: 'one label only' },
    footwork: { snaps: footwork.snaps, kappa: footwork.kappa, observed: footwork.observed, expected: footwork.expected, note: null },
    hands: { snaps: hands.snaps, kappa: hands.kappa, observed: hands.observed, expected: hands.expected, note: null },
    padLevel: none,
    effort: none,
  },
  disagreements: [
    { snapId: 501, sessionId: 31, sessionTitle: 'Week 1 vs Carrow Ridge', snapOrder: 12, playerId: 11, playerName: 'Tomas Varga', component: 'footwork', a: 'plus', b: 'minus' },
    { snapId: 502, sessionId: 31, sessionTitle: 'Week 1 vs Carrow Ridge', snapOrder: 13, playerId: 13, playerName: 'Eli Brandt', component: 'hands', a: 'minus', b: 'plus' },
  ],
};

const progress = (graders: GradingProgress['graders']): GradingProgress => ({ expectedCells: 300, graders, finalCells: 250, locked: false, lockHistory: [] });

describe('CalibrationPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<CalibrationPage>;
  const element = () => fixture.nativeElement as HTMLElement;
  const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match((r) => r.url === url)[0]), url)).flush(body);

  beforeEach(async () => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).setSession(sessionFor('coach'));
    fixture = TestBed.createComponent(CalibrationPage);
    fixture.componentRef.setInput('graderA', '7');
    fixture.componentRef.setInput('graderB', '9');
    await answer('/api/teams/1', TEAM);
    await answer('/api/film-sessions', { sessions: [filmSession({ id: 31, snapCount: 60 }), filmSession({ id: 33, snapCount: 55, date: '2026-09-11' })], seasonId: 5 });
    await answer('/api/film-sessions/33/grading-progress', progress([{ graderId: 7, name: 'Dana Keel', gradedCells: 200, designated: true }]));
    await answer('/api/film-sessions/31/grading-progress', progress([{ graderId: 7, name: 'Dana Keel', gradedCells: 250, designated: true }, { graderId: 9, name: 'Cal Dorsey', gradedCells: 120, designated: false }]));
    const agreement = await waitFor(() => (TestBed.tick(), http.match((r) => r.url === '/api/teams/1/agreement')[0]), 'agreement');
    expect(agreement.request.params.get('graderA')).toBe('7');
    expect(agreement.request.params.get('graderB')).toBe('9');
    agreement.flush(AGREEMENT);
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const row = (part: string) => Array.from(element().querySelector(`[data-testid=kappa-table] tr[data-part=${part}]`)!.children, (c) => c.textContent?.replace(/\s+/g, ' ').trim());

  it('shows kappa per part with its band in words and the snaps compared', () => {
    // By hand: pₒ = 37/40 = 0.925; pₑ = (32·31 + 8·9)/40² = 0.665; κ = 0.26/0.335 ≈ 0.776: substantial (0.61–0.80).
    expect(footwork.kappa!).toBeCloseTo(0.776, 3);
    expect(row('footwork')).toEqual(['Footwork', '40', '0.78', '● substantial agreement', '93 %', '67 %']);
    expect(row('hands')[2]).toBe(hands.kappa!.toFixed(2).replace('-', '−'));
    expect(row('hands')[3]).toContain('only 6 snaps compared: kappa can swing a lot');
    expect(row('assignment')[3]).toContain('kappa cannot be computed');
    expect(row('padLevel')).toEqual(['Pad level', '0', '—', 'No snap that both graded: nothing to compare.', '—', '—']);
    expect(element().textContent).toContain('Landis & Koch (1977), from memory');
    expect(element().textContent).toContain('0.61–0.80: substantial agreement');
  });

  it('names the two graders and lists each disagreement one click from the desk', () => {
    expect(element().querySelector('h2')?.textContent).toBe('Dana Keel and Cal Dorsey');
    const rows = element().querySelectorAll('[data-testid=disagreements] tbody tr');
    expect(rows).toHaveLength(2);
    expect(rows[0].textContent).toContain('Tomas Varga');
    expect(rows[0].textContent).toContain('+ plus');
    expect(rows[0].textContent).toContain('− minus');
    expect(rows[0].querySelector('a')?.getAttribute('href')).toBe('/grading/31?snap=501');
  });
});
