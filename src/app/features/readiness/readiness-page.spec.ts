import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideAnimationsAsync } from '@angular/platform-browser/animations/async';
import { provideRouter } from '@angular/router';
import { wilsonInterval } from '@shared/stats';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { TEAM } from '../progress/development-test-data';
import { ReadinessPage } from './readiness-page';
import { lineDashboard, readiness } from './readiness-test-data';

describe('ReadinessPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<ReadinessPage>;

  beforeEach(async () => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideAnimationsAsync('noop'), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).setSession(sessionFor('coordinator'));
    fixture = TestBed.createComponent(ReadinessPage);
    const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match((r) => r.url === url)[0]), url)).flush(body);
    await answer('/api/teams/1', TEAM);
    await answer('/api/teams/1/readiness', readiness());
    await answer('/api/teams/1/line-dashboard', lineDashboard());
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const cell = (id: string) => element().querySelector(`td[data-cell="${id}"]`) as HTMLElement;

  it('marks a cell with few reps in words and a symbol, and a low cell as below the grade', () => {
    const few = cell('1-11');
    expect(few.textContent).toContain('7 reps');
    expect(few.textContent).toContain('◔ few reps');
    expect(few.querySelector('button')?.getAttribute('aria-label')).toContain('Inside zone against Bear: 71 % plus of 7 reps');
    expect(few.querySelector('button')?.getAttribute('aria-label')).toMatch(/; few reps, below the winning grade$/);
    const low = cell('2-10');
    expect(low.textContent).toContain('60 %');
    expect(low.textContent).toContain('▼ below grade');
    expect(low.textContent).not.toContain('few reps');
    const fine = cell('1-10');
    expect(fine.textContent).toContain('89 %');
    expect(fine.querySelector('.mark')).toBeNull();
    expect(cell('2-11').textContent).toContain('no reps');
    expect(element().querySelector('#grid-legend')?.textContent).toContain('fewer than 12 graded reps');
  });

  it('opens a cell with its interval and its game and practice reps', async () => {
    cell('1-11').querySelector('button')!.click();
    await fixture.whenStable();
    const dialog = document.querySelector('tw-readiness-cell-dialog') as HTMLElement;
    const [low, high] = wilsonInterval(5, 7)!;
    expect(dialog.textContent).toContain('Inside zone against Bear');
    expect(dialog.textContent).toContain(`5 plus of 7 reps; 95 % interval ${Math.round(low * 100)}–${Math.round(high * 100)} %.`);
    const split = Array.from(dialog.querySelectorAll('tr'), (tr) => Array.from(tr.children, (c) => c.textContent?.trim()).join(' '));
    expect(split).toEqual(['Game reps 4', 'Practice reps 3', 'All reps 7']);
  });

  it('lists where to put practice reps, thin-and-low first', () => {
    const items = Array.from(element().querySelectorAll('[data-testid=priorities] li > strong'), (s) => s.textContent);
    expect(items).toEqual(['Inside zone against Bear', 'Power against Over', 'Power against Bear']);
  });

  it('puts the safety caution right under where to put practice reps', () => {
    const heading = Array.from(element().querySelectorAll('h2')).find((h) => h.textContent === 'Where to put practice reps');
    expect(heading?.nextElementSibling?.tagName).toBe('TW-SAFETY-NOTE');
  });

  it('shows missed assignments as positions by reason with totals', () => {
    const rows = Array.from(element().querySelectorAll('[data-testid=missed-table] tr'), (tr) => Array.from(tr.children, (c) => c.textContent?.trim()));
    expect(rows).toEqual([
      ['Position', 'wrong gap or man', 'communication', 'All'],
      ['LT', '2', '1', '3'],
      ['RG', '4', '·', '4'],
      ['All', '6', '1', '7'],
    ]);
  });

  it('names who was the weakest link most often', () => {
    const rows = Array.from(element().querySelectorAll('[data-testid=weakest-links] tbody tr'), (tr) => Array.from(tr.children, (c) => c.textContent?.trim()));
    expect(rows).toEqual([
      ['Odran Pike', '9'],
      ['Teodor Vance', '4'],
    ]);
  });

  it('draws the unit grade by game with a numbers table a click away', async () => {
    const unit = element().querySelector('tw-unit-grade-chart') as HTMLElement;
    expect(unit.querySelector('ngx-charts-bar-horizontal')).not.toBeNull();
    (Array.from(unit.querySelectorAll('button')).find((b) => b.textContent?.includes('Show numbers')) as HTMLButtonElement).click();
    await fixture.whenStable();
    const first = Array.from(unit.querySelectorAll('tbody tr')[0].children, (c) => c.textContent?.trim());
    const [low, high] = wilsonInterval(27, 60)!;
    expect(first).toEqual(['Fri 4 Sep', 'Week 1 vs Carrow Ridge', '60', '27', '45 %', `${Math.round(low * 100)}–${Math.round(high * 100)} %`]);
  });
});
