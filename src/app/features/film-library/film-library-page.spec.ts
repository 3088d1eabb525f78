import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Team } from '@shared/api/team';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { FilmLibraryPage } from './film-library-page';
import { filmSession } from './film-test-data';

const TEAM: Team = {
  id: 1,
  name: 'Ironvale Anvils',
  currentSeasonId: 5,
  sharing: { gradesWithPlayers: true, unitWithPlayers: false },
  seasons: [{ id: 5, name: '2026 season', startsOn: '2026-08-01', endsOn: '2026-11-30', isCurrent: true }],
};

const SESSIONS = [
  filmSession({
    id: 3,
    title: 'Week 2 vs Quarry Bend',
    date: '2026-09-11',
    snapCount: 64,
    clipCounts: { received: 1, processing: 2, ready: 58, failed: 3 },
    posterUrl: '/api/clips/40/poster',
  }),
  filmSession({ id: 4, kind: 'practice', title: 'Tuesday practice', date: '2026-09-15', opponent: null, homeAway: null, week: 3, periods: ['inside run', 'team run'] }),
];

describe('FilmLibraryPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  function nextListRequest(): Promise<TestRequest> {
    return waitFor(() => {
      TestBed.tick();
      return http.match((r) => r.url === '/api/film-sessions')[0];
    }, 'the session list request');
  }

  async function render(): Promise<{ fixture: ComponentFixture<FilmLibraryPage>; first: TestRequest }> {
    TestBed.inject(AuthStore).setSession(sessionFor('analyst'));
    const fixture = TestBed.createComponent(FilmLibraryPage);
    (await waitFor(() => (TestBed.tick(), http.match('/api/teams/1')[0]), 'the team request')).flush(TEAM);
    const first = await nextListRequest();
    const params = first.request.params;
    first.flush({ sessions: SESSIONS, seasonId: 5 });
    await fixture.whenStable();
    expect(params.get('teamId')).toBe('1');
    return { fixture, first };
  }

  function rows(fixture: ComponentFixture<FilmLibraryPage>): string[] {
    const found = (fixture.nativeElement as HTMLElement).querySelectorAll('[data-testid=film-session]');
    return Array.from(found, (row) => (row.textContent ?? '').replace(/\s+/g, ' ').trim());
  }

  it('lists the season sessions newest first with kind, opponent and clip states in words', async () => {
    const { fixture, first } = await render();
    expect(first.request.params.get('seasonId')).toBe('5');
    const [practice, game] = rows(fixture);
    expect(practice).toContain('Practice');
    expect(practice).toContain('Tuesday practice');
    expect(practice).toContain('2 periods');
    expect(practice).toContain('No clips yet');
    expect(game).toContain('Game');
    expect(game).toContain('vs Quarry Bend Badgers');
    expect(game).toContain('64');
    expect(game).toContain('1 received');
    expect(game).toContain('2 processing');
    expect(game).toContain('58 ready');
    expect(game).toContain('3 failed');
    const link = (fixture.nativeElement as HTMLElement).querySelector('a.title[href="/film/3"]');
    expect(link?.textContent).toContain('Week 2 vs Quarry Bend');
    expect((fixture.nativeElement as HTMLElement).querySelector('img[src="/api/clips/40/poster"]')).not.toBeNull();
  });

  it('asks the server for one kind when a filter is chosen', async () => {
    const { fixture } = await render();
    const toggles = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll<HTMLButtonElement>('mat-button-toggle button'));
    toggles.find((b) => b.textContent?.includes('Practices'))!.click();
    const filtered = await nextListRequest();
    expect(filtered.request.params.get('kind')).toBe('practice');
    filtered.flush({ sessions: [SESSIONS[1]], seasonId: 5 });
    await fixture.whenStable();
    expect(rows(fixture)).toEqual([expect.stringContaining('Tuesday practice')]);
  });

  it('says what to do when the season has no film yet', async () => {
    TestBed.inject(AuthStore).setSession(sessionFor('coach'));
    const fixture = TestBed.createComponent(FilmLibraryPage);
    (await waitFor(() => (TestBed.tick(), http.match('/api/teams/1')[0]), 'the team request')).flush(TEAM);
    (await nextListRequest()).flush({ sessions: [], seasonId: 5 });
    await fixture.whenStable();
    expect(fixture.nativeElement.textContent).toContain('No film sessions in this season yet');
  });
});
