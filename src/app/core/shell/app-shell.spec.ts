import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Role } from '@shared/roles';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { AuthStore } from '../auth/auth-store';
import { DevMailProbe } from '../dev/dev-mail-probe';
import { AppShell } from './app-shell';

describe('AppShell navigation', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function render(role: Role, devMail: 'on' | 'off' = 'off', extraTeams: Parameters<typeof sessionFor>[1] = [], unitWithPlayers = false) {
    TestBed.inject(AuthStore).setSession(sessionFor(role, extraTeams));
    const fixture = TestBed.createComponent(AppShell);
    fixture.detectChanges();
    const probe = http.expectOne('/api/dev/mail');
    if (devMail === 'on') probe.flush({ messages: [] });
    else probe.flush({ error: { code: 'not_found', message: 'Not found.' } }, { status: 404, statusText: 'Not Found' });
    await TestBed.inject(DevMailProbe).check();
    // What the team shares with players decides a player's links.
    (await waitFor(() => (TestBed.tick(), http.match('/api/teams/1')[0]), 'the team')).flush({ id: 1, name: 'Ironvale Anvils', currentSeasonId: null, seasons: [], sharing: { gradesWithPlayers: true, unitWithPlayers } });
    await fixture.whenStable();
    return fixture;
  }

  function navLabels(fixture: ComponentFixture<AppShell>): string[] {
    const links = (fixture.nativeElement as HTMLElement).querySelectorAll('nav[aria-label=Main] a');
    // The title element only: the icon's ligature text is not part of the label.
    return Array.from(links, (a) => a.querySelector('[matListItemTitle]')?.textContent?.trim() ?? '');
  }

  it('gives a player his Study Queue but no Roster or Staff link', async () => {
    const fixture = await render('player');
    const labels = navLabels(fixture);
    expect(labels).toEqual(['This Week', 'Study Queue', 'Progress', 'Mail settings']);
    expect(labels).not.toContain('Roster');
    expect(labels).not.toContain('Staff');
    expect(labels).not.toContain('Cut-ups');
    expect(labels).not.toContain('Readiness Grid');
  });

  it('gives an admin both Roster and Staff', async () => {
    const fixture = await render('admin');
    expect(navLabels(fixture)).toEqual(['This Week', 'Film Library', 'Grading Desk', 'Cut-ups', 'Readiness Grid', 'Depth Chart', 'Position Battle', 'Calibration', 'Roster', 'Staff', 'Mail settings']);
  });

  it('gives a position coach the Roster but not Staff', async () => {
    const fixture = await render('coach');
    expect(navLabels(fixture)).toEqual(['This Week', 'Film Library', 'Grading Desk', 'Cut-ups', 'Readiness Grid', 'Depth Chart', 'Position Battle', 'Calibration', 'Roster', 'Mail settings']);
  });

  it('adds the dev mailbox only when the API answers for it', async () => {
    const fixture = await render('analyst', 'on');
    expect(navLabels(fixture)).toEqual(['This Week', 'Film Library', 'Readiness Grid', 'Depth Chart', 'Position Battle', 'Roster', 'Mail settings', 'Dev mailbox']);
  });

  it('follows the role of the team picked in the switcher', async () => {
    const fixture = await render('player', 'off', [{ teamId: 2, teamName: 'Ironvale Anvils JV', role: 'coordinator' }]);
    expect(navLabels(fixture)).not.toContain('Roster');
    TestBed.inject(AuthStore).selectTeam(2);
    (await waitFor(() => (TestBed.tick(), http.match('/api/teams/2')[0]), 'the second team')).flush({ id: 2, name: 'Ironvale Anvils JV', currentSeasonId: null, seasons: [], sharing: { gradesWithPlayers: true, unitWithPlayers: false } });
    await fixture.whenStable();
    expect(navLabels(fixture)).toEqual(['This Week', 'Film Library', 'Grading Desk', 'Cut-ups', 'Readiness Grid', 'Depth Chart', 'Position Battle', 'Calibration', 'Roster', 'Mail settings']);
    expect(localStorage.getItem('trenchwork.selectedTeamId')).toBe('2');
    expect((fixture.nativeElement as HTMLElement).querySelector('tw-team-switcher')?.textContent).toContain('Ironvale Anvils JV');
  });

  it("adds the Readiness Grid for a player only while his team shares the line's numbers", async () => {
    const fixture = await render('player', 'off', [], true);
    expect(navLabels(fixture)).toEqual(['This Week', 'Study Queue', 'Progress', 'Readiness Grid', 'Mail settings']);
  });
});
