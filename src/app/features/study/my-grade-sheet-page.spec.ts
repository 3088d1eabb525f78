import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { PlayerGradeSheet } from '@shared/api/player-grades';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { sheetPlayer } from '../grading-desk/grading-test-data';
import { MyGradeSheetPage } from './my-grade-sheet-page';

describe('MyGradeSheetPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<MyGradeSheetPage>;

  const SHEET: PlayerGradeSheet = {
    sessionId: 3,
    sessionTitle: 'Week 2 vs Quarry Bend',
    sessionDate: '2026-09-11',
    winningThreshold: 0.8,
    extraLabels: { finish: 'Finish' },
    player: sheetPlayer({ playerId: 74, name: 'Dana Keel' }),
  };

  /** Opens the page as the signed-in player (player 74) and returns his sheet's request. */
  async function open(): Promise<TestRequest> {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).setSession(sessionFor('player'));
    fixture = TestBed.createComponent(MyGradeSheetPage);
    fixture.componentRef.setInput('sessionId', '3');
    return waitFor(() => (TestBed.tick(), http.match(() => true)[0]), 'his sheet');
  }

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const text = () => (element().textContent ?? '').replace(/\s+/g, ' ');

  it('asks for his own row only, and shows it read only with the team\'s own parts named', async () => {
    const request = await open();
    expect(request.request.url).toBe('/api/film-sessions/3/grade-sheet/players/74');
    request.flush(SHEET);
    await fixture.whenStable();
    expect(text()).toContain('Week 2 vs Quarry Bend');
    expect(element().querySelector('[data-testid=plus-rate]')?.textContent?.trim()).toBe('79 %');
    expect(element().querySelector('[data-testid=winning-line]')?.textContent).toContain('Winning grade 80 %: not met');
    expect(Array.from(element().querySelectorAll('table.parts tbody th'), (th) => th.textContent?.trim())).toContain('Finish');
    expect(element().querySelectorAll('tw-player-sheet-card')).toHaveLength(1);
    // His coaches' technique notes come with the safety caution.
    expect(text()).toContain('Punch late on the double');
    expect(element().querySelector('tw-safety-note [role=note]')?.textContent).toContain('Safety:');
    // Read only: nothing to mail, export or change (the caution's own opener aside).
    expect(Array.from(element().querySelectorAll('button, input, select')).filter((e) => !e.closest('tw-safety-note'))).toHaveLength(0);
    expect(element().querySelector('a[href="/study"]')).not.toBeNull();
  });

  it('shows no caution when his sheet carries no notes', async () => {
    (await open()).flush({ ...SHEET, player: sheetPlayer({ playerId: 74, notes: [] }) });
    await fixture.whenStable();
    expect(element().querySelector('tw-player-sheet-card')).not.toBeNull();
    expect(element().querySelector('tw-safety-note')).toBeNull();
  });

  it('says so when he has no grades in the session yet', async () => {
    (await open()).flush({ ...SHEET, player: null });
    await fixture.whenStable();
    expect(text()).toContain('No grades for you in this session yet.');
    expect(element().querySelector('tw-player-sheet-card')).toBeNull();
  });

  it('shows the reason when his staff does not share grades', async () => {
    (await open()).flush({ error: { code: 'forbidden', message: 'Your staff has not shared grades with players.' } }, { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    expect(element().querySelector('[role=alert]')?.textContent).toContain('Your staff has not shared grades with players.');
    expect(element().querySelector('tw-player-sheet-card')).toBeNull();
  });
});
