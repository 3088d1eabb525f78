import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideAnimationsAsync } from '@angular/platform-browser/animations/async';
import { provideRouter } from '@angular/router';
import type { Role } from '@shared/roles';
import { wilsonInterval } from '@shared/stats';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { TEAM, development } from './development-test-data';
import type { Development } from './development-types';
import { ProgressPage } from './progress-page';

describe('ProgressPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<ProgressPage>;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideAnimationsAsync('noop'), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const answerDevelopment = async (body: Development) => {
    const request = await waitFor(() => (TestBed.tick(), http.match((r) => r.url === '/api/players/11/development')[0]), 'development');
    expect(request.request.params.get('seasonId')).toBe('5');
    request.flush(body);
    await fixture.whenStable();
  };

  async function render(role: Role, body: Development = development()) {
    TestBed.inject(AuthStore).setSession(sessionFor(role));
    fixture = TestBed.createComponent(ProgressPage);
    fixture.componentRef.setInput('playerId', '11');
    (await waitFor(() => (TestBed.tick(), http.match('/api/teams/1')[0]), 'team')).flush(TEAM);
    await answerDevelopment(body);
  }

  it('says the trend in words with its slope per week and the rule behind it', async () => {
    await render('coach');
    expect(element().querySelector('h1')?.textContent).toContain('Progress · Tomas Varga');
    expect(element().querySelector('[data-testid=trend-reading]')?.textContent?.trim()).toMatch(/improving$/);
    expect(element().querySelector('[data-testid=trend-slope]')?.textContent).toBe('+3.1 points a week (95 % interval +1.2 to +5.0 points) over 4 graded weeks');
    expect(element().textContent).toContain('fewer than 4 graded weeks, is "not enough data yet"');
    expect(element().querySelector('[data-testid=overall-rate]')?.textContent?.trim()).toBe('79 %');
    expect(element().textContent).toContain('plus on 253 snaps graded');
    expect(element().textContent).toContain('✗ below the winning grade (80 %)');
  });

  it('reads "not enough data yet" without a slope when the season is short', async () => {
    await render('player', development({ trend: { slopePerWeek: null, slopeInterval: null, weeks: 1, reading: 'not enough data yet' } }));
    expect(element().querySelector('[data-testid=trend-reading]')?.textContent).toContain('not enough data yet');
    expect(element().querySelector('[data-testid=trend-slope]')).toBeNull();
    expect(element().textContent).toContain('Fewer than two graded weeks: no slope yet.');
  });

  it('draws one trend per part of the grade and shows its numbers on request', async () => {
    await render('coach');
    const charts = Array.from(element().querySelectorAll('tw-trend-chart'));
    expect(charts.map((c) => c.querySelector('h3')?.textContent)).toEqual(['Overall grade', 'Assignment', 'Footwork', 'Hands', 'Pad level', 'Effort']);
    const overall = charts[0] as HTMLElement;
    expect(overall.querySelector('ngx-charts-line-chart')).not.toBeNull();
    expect(overall.querySelector('table')).toBeNull();
    const toggle = Array.from(overall.querySelectorAll('button')).find((b) => b.textContent?.includes('Show numbers')) as HTMLButtonElement;
    toggle.click();
    await fixture.whenStable();
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
    const rows = Array.from(overall.querySelectorAll('table tbody tr'), (tr) => Array.from(tr.children, (td) => td.textContent?.trim()));
    const [low, high] = wilsonInterval(38, 52)!;
    expect(rows[0]).toEqual(['Fri 4 Sep', 'Week 1 vs Carrow Ridge', '52', '38', '73 %', `${Math.round(low * 100)}–${Math.round(high * 100)} %`, '—']);
    expect(rows).toHaveLength(5);
    expect(rows[4][6]).toBe(`${Math.round(((44 + 47 + 50) / (56 + 57 + 58)) * 100)} %`);
  });

  it('lists every session, the strongest and weakest concepts and fronts with their snaps, and splits', async () => {
    await render('coach');
    expect(element().querySelectorAll('[data-testid=sessions-table] tbody tr')).toHaveLength(5);
    const text = element().textContent ?? '';
    expect(text).toMatch(/Inside zone: 85 % of 82 snaps \(95 % interval \d+–\d+ %\)/);
    expect(text).toMatch(/Bear: 57 % of 35 snaps/);
    const fronts = Array.from(element().querySelectorAll('mat-button-toggle button')).find((b) => b.textContent?.includes('Front')) as HTMLButtonElement;
    fronts.click();
    await fixture.whenStable();
    const split = element().querySelector('tw-split-chart') as HTMLElement;
    (Array.from(split.querySelectorAll('button')).find((b) => b.textContent?.includes('Show numbers')) as HTMLButtonElement).click();
    await fixture.whenStable();
    expect(Array.from(split.querySelectorAll('tbody tr'), (tr) => tr.children[0].textContent)).toEqual(['Over', 'Bear']);
  });

  it('shows goals against the current rate and lets a coach set one', async () => {
    await render('coach');
    const goal = element().querySelector('[data-testid=goal]') as HTMLElement;
    expect(goal.textContent).toContain('Pad level: 80 %');
    expect(goal.textContent).toContain('Not there yet');
    expect(goal.textContent).toContain('Now 67 % of 253 snaps, target 80 %: 13 points to go');
    (Array.from(element().querySelectorAll('button')).find((b) => b.textContent?.includes('Set a goal')) as HTMLButtonElement).click();
    await fixture.whenStable();
    const form = element().querySelector('form[aria-label="New goal"]') as HTMLFormElement;
    const target = form.querySelector('input[type=number]') as HTMLInputElement;
    target.value = '85';
    target.dispatchEvent(new Event('input'));
    form.dispatchEvent(new Event('submit'));
    const post = http.expectOne('/api/players/11/goals');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({ component: 'overall', target: 0.85 });
    post.flush({ goals: [] });
    await answerDevelopment(development());
  });

  it('lets a coach add a note and shows it after the reload', async () => {
    await render('coach');
    const form = element().querySelector('form[aria-label="New coach note"]') as HTMLFormElement;
    const body = form.querySelector('textarea') as HTMLTextAreaElement;
    body.value = '  Hands inside on the down block.  ';
    body.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    (form.querySelector('button[type=submit]') as HTMLButtonElement).click();
    const post = http.expectOne('/api/players/11/notes');
    expect(post.request.body).toEqual({ body: 'Hands inside on the down block.' });
    post.flush({ notes: [] });
    const note = { id: 9, body: 'Hands inside on the down block.', author: 'Dana Keel', createdAt: '2026-09-27T09:00:00.000Z' };
    await answerDevelopment(development({ notes: [note, ...development().notes] }));
    expect(element().querySelector('tw-notes-panel li')?.textContent).toContain('Hands inside on the down block.');
    expect(body.value).toBe('');
  });

  it('gives a player his page without the coach forms', async () => {
    await render('player');
    expect(element().textContent).not.toContain('Set a goal');
    expect(element().querySelector('form[aria-label="New coach note"]')).toBeNull();
    expect(element().textContent).toContain('Quicker first step against the 4i.');
    expect(element().querySelector('a[href="/progress"]')).toBeNull();
    // His goals are technique targets: the safety caution goes with them.
    expect(element().querySelector('tw-goals-panel tw-safety-note [role=note]')?.textContent).toContain('Safety:');
  });
});
