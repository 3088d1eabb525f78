import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import type { DepthChart } from '@shared/api/grading';
import { comparePair, rateWithInterval } from '@shared/stats';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { TEAM, development, rate } from '../progress/development-test-data';
import type { Comparison } from './comparison-types';
import { PositionBattlePage } from './position-battle-page';

const varga = rateWithInterval(180, 40);
const lund = rateWithInterval(19, 6);
/** The API's own reading, made by the same shared function the server uses. */
const pair = comparePair({ name: 'Tomas Varga', ...varga }, { name: 'Abe Lund', ...lund });

const COMPARISON: Comparison = {
  seasonId: 5,
  players: [
    { playerId: 11, name: 'Tomas Varga', snaps: varga.snaps, plus: varga.plus, rate: varga.rate, interval: varga.interval, components: { assignment: rate(210, 10) }, positionsPlayed: { LT: 200, LG: 20 }, sparkline: [{ date: '2026-09-04', rate: 0.7 }, { date: '2026-09-11', rate: 0.85 }] },
    { playerId: 22, name: 'Abe Lund', snaps: lund.snaps, plus: lund.plus, rate: lund.rate, interval: lund.interval, components: {}, positionsPlayed: { LG: 25 }, sparkline: [{ date: '2026-09-11', rate: 0.76 }] },
  ],
  pairs: [{ a: 11, b: 22, difference: pair.difference, z: pair.z, pValue: pair.pValue, probabilityABetter: pair.probabilityAHigher, reading: pair.reading, warning: pair.warning }],
};
const CHART: DepthChart = { seasonId: 5, updatedAt: null, week: 0, inForceFromWeek: 0, savedWeeks: [0], lastGameWeek: null, positions: { LT: [], LG: [{ playerId: 12, name: 'Rowan Pike', jersey: 66 }, { playerId: 22, name: 'Abe Lund', jersey: 63 }], C: [], RG: [], RT: [], TE: [] } };

describe('PositionBattlePage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<PositionBattlePage>;
  const element = () => fixture.nativeElement as HTMLElement;
  const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match((r) => r.url === url)[0]), url)).flush(body);

  beforeEach(async () => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).setSession(sessionFor('coordinator'));
    fixture = TestBed.createComponent(PositionBattlePage);
    fixture.componentRef.setInput('players', '11,22');
    await answer('/api/teams/1', TEAM);
    await answer('/api/teams/1/players', { players: [], seasonId: 5 });
    await answer('/api/teams/1/depth-chart', CHART);
    const compare = await waitFor(() => (TestBed.tick(), http.match((r) => r.url === '/api/comparisons')[0]), 'comparison');
    expect(compare.request.params.get('players')).toBe('11,22');
    expect(compare.request.params.get('seasonId')).toBe('5');
    compare.flush(COMPARISON);
    await answer('/api/players/11/development', development());
    await answer('/api/players/22/development', development({ playerId: 22, name: 'Abe Lund', splits: { ...development().splits, concept: [{ value: 'Power', ...rate(9, 3) }] } }));
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  it('shows the API reading of each pair and the small-sample warning', () => {
    const card = element().querySelector('[data-testid=pair]') as HTMLElement;
    expect(card.textContent).toContain('Tomas Varga and Abe Lund');
    expect(card.querySelector('.reading')?.textContent).toBe(pair.reading);
    expect(pair.reading).toMatch(/^Tomas Varga graded plus on 82 % of 220 snaps, Abe Lund on 76 % of 25; probability Tomas Varga's true rate is higher: 0\.\d\d$/);
    expect(card.querySelector('[data-testid=pair-warning]')?.textContent).toContain('too few snaps to tell: fewer than 30 graded snaps on one side');
  });

  it('plots each rate with its interval, with the numbers in a table and the winning-grade line', () => {
    const plot = element().querySelector('tw-interval-plot svg') as SVGElement;
    expect(plot.getAttribute('aria-label')).toContain('Abe Lund 76 % of 25 snaps');
    expect(plot.querySelectorAll('circle.dot')).toHaveLength(2);
    expect(plot.textContent).toContain('winning grade');
    const rows = Array.from(element().querySelectorAll('[data-testid=rates-table] tbody tr'), (tr) => Array.from(tr.children, (c) => c.textContent?.trim()));
    expect(rows[1]).toEqual(['Abe Lund', '25', '19', '76 %', `${Math.round(lund.interval![0] * 100)}–${Math.round(lund.interval![1] * 100)} %`]);
  });

  it('lines up parts, concept splits, sparklines and positions played', () => {
    const parts = element().querySelector('[data-testid=components-table] tbody tr') as HTMLElement;
    expect(parts.children[1].textContent).toContain('95 % of 220 snaps');
    expect(parts.children[2].textContent?.trim()).toBe('—');
    const concept = Array.from(element().querySelectorAll('.splits table')[0].querySelectorAll('tbody tr'), (tr) => tr.children[0].textContent);
    expect(concept).toEqual(['Inside zone', 'Power', 'Counter']);
    const versatility = Array.from(element().querySelectorAll('[data-testid=versatility]'), (p) => p.textContent);
    expect(versatility).toEqual(['2 positions: LT 200 snaps, LG 20 snaps', 'One position: LG 25 snaps']);
    expect(element().querySelector('tw-sparkline')?.textContent).toContain('70 % first session, 85 % latest, over 2 sessions');
  });

  it('puts a depth-chart position\'s candidates in the address', async () => {
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    (Array.from(element().querySelectorAll('button')).find((b) => b.textContent?.includes('LG · 2 listed')) as HTMLButtonElement).click();
    expect(navigate).toHaveBeenCalledWith([], { queryParams: { players: '12,22' }, queryParamsHandling: 'merge' });
  });
});
