import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Team } from '@shared/api/team';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { TeamStore } from '../../core/team/team-store';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { SharingSettings } from './sharing-settings';

describe('SharingSettings', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<SharingSettings>;

  const TEAM: Team = { id: 1, name: 'Ironvale Anvils', currentSeasonId: 5, seasons: [], sharing: { gradesWithPlayers: true, unitWithPlayers: false } };

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).setSession(sessionFor('coordinator'));
    fixture = TestBed.createComponent(SharingSettings);
    (await waitFor(() => (TestBed.tick(), http.match('/api/teams/1')[0]), 'the team')).flush(TEAM);
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const toggle = (key: string) => element().querySelector(`[data-testid=share-${key}] button`) as HTMLButtonElement;
  const patched = () => waitFor(() => http.match((r) => r.method === 'PATCH' && r.url === '/api/teams/1/sharing')[0], 'the PATCH');

  it('shows both switches as the team has them, each in words', () => {
    expect(toggle('gradesWithPlayers').getAttribute('aria-checked')).toBe('true');
    expect(toggle('unitWithPlayers').getAttribute('aria-checked')).toBe('false');
    const text = element().textContent ?? '';
    expect(text).toContain("On: Players see their own grades");
    expect(text).toContain("Off: Players see the line's numbers");
  });

  it("turns one switch with the existing PATCH route and keeps the team's answer", async () => {
    toggle('unitWithPlayers').click();
    const request = await patched();
    expect(request.request.body).toEqual({ unitWithPlayers: true });
    request.flush({ gradesWithPlayers: true, unitWithPlayers: true });
    await fixture.whenStable();
    expect(toggle('unitWithPlayers').getAttribute('aria-checked')).toBe('true');
    expect(element().textContent).toContain('Players may open the Readiness Grid');
    // The nav and the route guard read the same store.
    expect(TestBed.inject(TeamStore).sharing()).toEqual({ gradesWithPlayers: true, unitWithPlayers: true });
  });

  it('sets the switch back when the save is refused', async () => {
    toggle('gradesWithPlayers').click();
    const request = await patched();
    expect(request.request.body).toEqual({ gradesWithPlayers: false });
    request.flush({ error: { code: 'forbidden', message: 'You do not have access to this.' } }, { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    expect(toggle('gradesWithPlayers').getAttribute('aria-checked')).toBe('true');
    expect(TestBed.inject(TeamStore).sharing()).toEqual({ gradesWithPlayers: true, unitWithPlayers: false });
  });
});
