import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Player } from '@shared/api/roster';
import type { Team } from '@shared/api/team';
import type { Role } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { RosterPage } from './roster-page';

const TEAM: Team = {
  id: 1,
  name: 'Ironvale Anvils',
  currentSeasonId: 5,
  sharing: { gradesWithPlayers: true, unitWithPlayers: false },
  seasons: [
    { id: 4, name: '2025 season', startsOn: '2025-08-01', endsOn: '2025-11-30', isCurrent: false },
    { id: 5, name: '2026 season', startsOn: '2026-08-01', endsOn: '2026-11-30', isCurrent: true },
  ],
};

function player(overrides: Partial<Player>): Player {
  return {
    id: 1,
    name: 'Player',
    jersey: 50,
    positions: ['LG'],
    classYear: 'Jr',
    redshirt: false,
    heightIn: null,
    weightLb: null,
    status: 'active',
    seasonId: 5,
    accountEmail: null,
    ...overrides,
  };
}

const PLAYERS: Player[] = [
  player({ id: 11, name: 'Tomas Varga', jersey: 74, positions: ['LT', 'LG'], classYear: 'Sr', redshirt: true, heightIn: 77, weightLb: 295, accountEmail: 'tomas.varga@ironvale.test' }),
  player({ id: 12, name: 'Eli Brandt', jersey: 55, positions: ['C'], heightIn: 74, weightLb: 280, status: 'injured' }),
  player({ id: 13, name: 'Odell Fry', jersey: 61, positions: ['RG'], classYear: 'So', status: 'inactive' }),
];

describe('RosterPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  /** Renders the page and answers the team and roster requests it makes. */
  async function render(role: Role): Promise<ComponentFixture<RosterPage>> {
    TestBed.inject(AuthStore).setSession(sessionFor(role));
    const fixture = TestBed.createComponent(RosterPage);
    const teamRequest = await waitFor(() => { TestBed.tick(); return http.match('/api/teams/1')[0]; }, 'the team request');
    teamRequest.flush(TEAM);
    (await nextRosterRequest()).flush({ players: PLAYERS, seasonId: 5 });
    await fixture.whenStable();
    return fixture;
  }

  function nextRosterRequest(): Promise<TestRequest> {
    return waitFor(() => {
      TestBed.tick();
      return http.match((r) => r.url === '/api/teams/1/players')[0];
    }, 'the roster request');
  }

  function rowTexts(fixture: ComponentFixture<RosterPage>): string[] {
    const rows = (fixture.nativeElement as HTMLElement).querySelectorAll('tr.mat-mdc-row:not(.no-match)');
    return Array.from(rows, (row) => (row.textContent ?? '').replace(/\s+/g, ' ').trim());
  }

  it('renders the season roster from the API, inactive entries hidden', async () => {
    const fixture = await render('admin');
    const rows = rowTexts(fixture);
    expect(rows).toHaveLength(2);
    // Sorted by jersey: 55 before 74.
    expect(rows[0]).toContain('55');
    expect(rows[0]).toContain('Eli Brandt');
    expect(rows[0]).toContain('Injured');
    expect(rows[0]).toContain('6-2');
    expect(rows[1]).toContain('Tomas Varga');
    expect(rows[1]).toContain('RS');
    expect(rows[1]).toContain('6-5');
    expect(rows[1]).toContain('295');
    expect(rows[1]).toContain('tomas.varga@ironvale.test');
    expect(rows.join(' ')).not.toContain('Odell Fry');
  });

  it('asks for the current season and shows inactive entries on request', async () => {
    const fixture = await render('admin');
    expect(TestBed.inject(AuthStore).teamId()).toBe(1);
    const toggle = fixture.nativeElement.querySelector('mat-slide-toggle button') as HTMLButtonElement;
    toggle.click();
    await fixture.whenStable();
    const rows = rowTexts(fixture);
    expect(rows).toHaveLength(3);
    expect(rows.find((r) => r.includes('Odell Fry'))).toContain('Inactive');
  });

  it('filters rows by the text in the search box', async () => {
    const fixture = await render('coordinator');
    const search = fixture.nativeElement.querySelector('input[placeholder^="Name"]') as HTMLInputElement;
    search.value = 'brandt';
    search.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(rowTexts(fixture)).toEqual([expect.stringContaining('Eli Brandt')]);
  });

  it('lets a position coach read but not edit', async () => {
    const fixture = await render('coach');
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Read only');
    expect(text).not.toContain('Add player');
    expect(fixture.nativeElement.querySelector('[aria-label^="Edit #"]')).toBeNull();
    expect(fixture.nativeElement.querySelector('a[download]')?.getAttribute('href')).toBe('/api/teams/1/players/export.csv?seasonId=5');
  });

  it('lists every bad row of a rejected import and says nothing was imported', async () => {
    const fixture = await render('admin');
    const picker = fixture.nativeElement.querySelector('[data-testid=roster-file]') as HTMLInputElement;
    const csv = 'name,jersey,positions,class\nRowan Pike,7x,LT,Jr\nCal Dorsey,60,QB,Sr\n';
    Object.defineProperty(picker, 'files', { value: [new File([csv], 'anvils.csv', { type: 'text/csv' })] });
    picker.dispatchEvent(new Event('change'));

    const upload = await waitFor(() => http.match('/api/teams/1/players/import')[0], 'the import request');
    expect(upload.request.body).toEqual({ csv, seasonId: 5 });
    upload.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'The file has problems; nothing was imported.',
          rows: [
            { row: 2, field: 'jersey', message: 'Jersey must be a number.' },
            { row: 3, field: 'positions', message: 'Positions are LT, LG, C, RG, RT, TE.' },
          ],
        },
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await fixture.whenStable();

    const report = fixture.nativeElement.querySelector('tw-import-report') as HTMLElement;
    expect(report.textContent).toContain('Nothing was imported from anvils.csv');
    const problems = Array.from(report.querySelectorAll('[data-testid=import-problems] tbody tr'), (tr) =>
      Array.from(tr.querySelectorAll('td'), (td) => td.textContent?.trim()),
    );
    expect(problems).toEqual([
      ['2', 'jersey', 'Jersey must be a number.'],
      ['3', 'positions', 'Positions are LT, LG, C, RG, RT, TE.'],
    ]);
    // Nothing changed, so the roster is not fetched again.
    http.expectNone((r) => r.url === '/api/teams/1/players');
  });

  it('reports the counts of a good import and reloads the roster', async () => {
    const fixture = await render('admin');
    const picker = fixture.nativeElement.querySelector('[data-testid=roster-file]') as HTMLInputElement;
    Object.defineProperty(picker, 'files', { value: [new File(['name,jersey,positions,class\n'], 'week1.csv')] });
    picker.dispatchEvent(new Event('change'));
    const upload = await waitFor(() => http.match('/api/teams/1/players/import')[0], 'the import request');
    upload.flush({ imported: 3, updated: 1 });
    (await nextRosterRequest()).flush({ players: PLAYERS, seasonId: 5 });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('tw-import-report')?.textContent).toContain('week1.csv: 3 players added, 1 updated.');
  });
});
