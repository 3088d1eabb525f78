import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, GuardResult, MaybeAsync, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';
import { STAFF_ROLES } from '@shared/roles';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { AuthStore } from './auth-store';
import { roleGuard } from './role-guard';
import { signedInGuard } from './signed-in-guard';

describe('route guards', () => {
  let http: HttpTestingController;
  const route = {} as ActivatedRouteSnapshot;
  const state = (url: string) => ({ url }) as RouterStateSnapshot;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  function run(guard: () => MaybeAsync<GuardResult>): Promise<GuardResult> {
    return Promise.resolve(TestBed.runInInjectionContext(guard) as Promise<GuardResult>);
  }

  function asText(result: GuardResult): string {
    return result instanceof UrlTree ? result.toString() : String(result);
  }

  describe('signedInGuard', () => {
    it('sends a visitor without a session to sign-in, keeping the address as next', async () => {
      const result = run(() => signedInGuard(route, state('/roster?seasonId=4')));
      http.expectOne('/api/auth/me').flush({ error: { code: 'unauthenticated', message: 'Sign in first.' } }, { status: 401, statusText: 'Unauthorized' });
      expect(asText(await result)).toBe('/sign-in?next=%2Froster%3FseasonId%3D4');
    });

    it('lets a signed-in user through and asks the server only once', async () => {
      const first = run(() => signedInGuard(route, state('/')));
      http.expectOne('/api/auth/me').flush(sessionFor('coach'));
      expect(await first).toBe(true);
      expect(await run(() => signedInGuard(route, state('/roster')))).toBe(true);
      http.expectNone('/api/auth/me');
    });
  });

  describe('roleGuard', () => {
    it('turns a player away from staff pages to This Week', async () => {
      TestBed.inject(AuthStore).setSession(sessionFor('player'));
      expect(asText(await run(() => roleGuard(STAFF_ROLES)(route, state('/roster'))))).toBe('/');
    });

    it('admits the roles it lists, in the selected team', async () => {
      const auth = TestBed.inject(AuthStore);
      auth.setSession(sessionFor('coach', [{ teamId: 2, teamName: 'Ironvale Anvils JV', role: 'admin' }]));
      expect(await run(() => roleGuard(STAFF_ROLES)(route, state('/roster')))).toBe(true);
      expect(asText(await run(() => roleGuard(['admin'])(route, state('/staff'))))).toBe('/');
      auth.selectTeam(2);
      expect(await run(() => roleGuard(['admin'])(route, state('/staff')))).toBe(true);
    });

    it('admits a player to a shared staff page only while his team has that switch on, asking the team fresh', async () => {
      TestBed.inject(AuthStore).setSession(sessionFor('player'));
      const team = (unitWithPlayers: boolean) => ({ id: 1, name: 'Ironvale Anvils', currentSeasonId: null, seasons: [], sharing: { gradesWithPlayers: true, unitWithPlayers } });
      const guard = () => roleGuard(STAFF_ROLES, 'unitWithPlayers')(route, state('/readiness'));
      const shared = run(guard);
      (await waitFor(() => http.match('/api/teams/1')[0], 'the team')).flush(team(true));
      expect(await shared).toBe(true);
      const notShared = run(guard);
      (await waitFor(() => http.match('/api/teams/1')[0], 'the team')).flush(team(false));
      expect(asText(await notShared)).toBe('/');
      // Staff pages without a switch stay closed to him, without asking.
      expect(asText(await run(() => roleGuard(STAFF_ROLES)(route, state('/roster'))))).toBe('/');
      http.expectNone('/api/teams/1');
    });
  });
});
