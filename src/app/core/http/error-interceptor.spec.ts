import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { sessionFor } from '../../../testing/sessions';
import { AuthStore } from '../auth/auth-store';
import { errorInterceptor } from './error-interceptor';
import { inlineErrors } from './inline-errors';

@Component({ template: '' })
class Blank {}

describe('errorInterceptor', () => {
  let http: HttpTestingController;
  let client: HttpClient;
  let router: Router;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'roster', component: Blank },
          { path: 'sign-in', component: Blank },
        ]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
    router = TestBed.inject(Router);
    await router.navigateByUrl('/roster');
  });

  afterEach(() => http.verify());

  async function fail(url: string, status: number, body: object, inline = false): Promise<void> {
    const call = firstValueFrom(client.get(url, inline ? { context: inlineErrors() } : {})).catch(() => undefined);
    http.expectOne(url).flush(body, { status, statusText: 'Error' });
    await call;
    await TestBed.inject(Router).navigated;
    await new Promise((resolve) => setTimeout(resolve, 0));
  }

  it('sends an expired session to sign-in with the page as next', async () => {
    const auth = TestBed.inject(AuthStore);
    auth.setSession(sessionFor('coach'));
    await fail('/api/teams/1/players', 401, { error: { code: 'unauthenticated', message: 'Sign in first.' } });
    expect(router.url).toBe('/sign-in?next=%2Froster&notice=expired');
    expect(auth.isSignedIn()).toBe(false);
  });

  it('leaves the /api/auth/me probe alone', async () => {
    await fail('/api/auth/me', 401, { error: { code: 'unauthenticated', message: 'Sign in first.' } }, true);
    expect(router.url).toBe('/roster');
  });

  it('shows other failures in a snackbar unless the caller shows them inline', async () => {
    await fail('/api/teams/1/staff', 403, { error: { code: 'forbidden', message: 'Only a program admin can do that.' } });
    expect(document.body.textContent).toContain('Only a program admin can do that.');
    await fail('/api/teams/1', 404, { error: { code: 'not_found', message: 'No such team here.' } }, true);
    expect(document.body.textContent).not.toContain('No such team here.');
  });
});
