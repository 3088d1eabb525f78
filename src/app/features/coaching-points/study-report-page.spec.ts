import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { waitFor } from '../../../testing/wait-for';
import { StudyReportPage } from './study-report-page';

describe('StudyReportPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<StudyReportPage>;

  const report = (group: string) => ({
    sessionId: 3,
    sessionTitle: 'Week 2 vs Quarry Bend',
    group,
    players: [
      { playerId: 74, name: 'Dana Keel', jersey: 74, clips: 4, watched: 3, points: 5, acknowledged: 5 },
      { playerId: 70, name: 'Bram Oakes', jersey: 70, clips: 2, watched: 2, points: 2, acknowledged: 2 },
      { playerId: 55, name: 'Ty Brandt', jersey: 55, clips: 3, watched: 0, points: 3, acknowledged: 1 },
    ],
  });

  const nextReport = () => waitFor(() => (TestBed.tick(), http.match((r) => r.url === '/api/film-sessions/3/study-report')[0]), 'the report');

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(StudyReportPage);
    fixture.componentRef.setInput('sessionId', '3');
    const first = await nextReport();
    expect(first.request.params.get('group')).toBe('OL');
    first.flush(report('OL'));
    await fixture.whenStable();
  });

  afterEach(() => {
    fixture.destroy();
    http.verify();
  });

  const element = () => fixture.nativeElement as HTMLElement;
  const rows = () => Array.from(element().querySelectorAll('[data-testid=report-row]'), (r) => (r.textContent ?? '').replace(/\s+/g, ' ').trim());
  const header = (label: string) => Array.from(element().querySelectorAll<HTMLButtonElement>('th button.sort')).find((b) => b.textContent?.trim().startsWith(label))!;

  it('lists the offensive line by jersey, in words, with who is not done', () => {
    const [first, second, third] = rows();
    expect(first).toContain('#55 Ty Brandt');
    expect(first).toContain('0 of 3 watched');
    expect(first).toContain('1 of 3 got it');
    expect(first).toContain('Not done yet');
    expect(second).toContain('#70 Bram Oakes');
    expect(second).toContain('Done');
    expect(third).toContain('3 of 4 watched');
    expect(element().querySelector('.summary')?.textContent).toContain('1 of 3 players have watched every clip and got every point.');
    expect(document.body.classList).toContain('tw-printing-study-report');
  });

  it('sorts by a column, and again the other way, saying so to screen readers', async () => {
    header('Watched').click();
    await fixture.whenStable();
    expect(rows().map((r) => r.split(' ')[0])).toEqual(['#55', '#74', '#70']);
    expect(header('Watched').closest('th')?.getAttribute('aria-sort')).toBe('ascending');
    header('Watched').click();
    await fixture.whenStable();
    expect(rows().map((r) => r.split(' ')[0])).toEqual(['#70', '#74', '#55']);
    expect(header('Watched').closest('th')?.getAttribute('aria-sort')).toBe('descending');
  });

  it('switches to another position group', async () => {
    Array.from(element().querySelectorAll<HTMLButtonElement>('.groups button')).find((b) => b.textContent?.trim() === 'Tight ends')!.click();
    const next = await nextReport();
    expect(next.request.params.get('group')).toBe('TE');
    next.flush({ ...report('TE'), players: [] });
    await fixture.whenStable();
    expect(element().textContent).toContain('Nobody in this group');
  });
});
