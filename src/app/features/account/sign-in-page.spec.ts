import { Component } from '@angular/core';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { SignInPage } from './sign-in-page';

@Component({ template: 'landed' })
class Landing {}

describe('SignInPage', () => {
  let http: HttpTestingController;
  let router: Router;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'sign-in', component: SignInPage },
          { path: 'roster', component: Landing },
          { path: '', component: Landing },
        ]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
  });

  afterEach(() => http.verify());

  async function render(next?: string): Promise<ComponentFixture<SignInPage>> {
    await router.navigateByUrl(next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in');
    const fixture = TestBed.createComponent(SignInPage);
    if (next) fixture.componentRef.setInput('next', next);
    await fixture.whenStable();
    return fixture;
  }

  function type(fixture: ComponentFixture<SignInPage>, selector: string, value: string): void {
    const input = fixture.nativeElement.querySelector(selector) as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  }

  function submit(fixture: ComponentFixture<SignInPage>): void {
    (fixture.nativeElement.querySelector('button[type=submit]') as HTMLButtonElement).click();
  }

  function text(fixture: ComponentFixture<SignInPage>): string {
    return (fixture.nativeElement as HTMLElement).textContent ?? '';
  }

  it('shows field errors and sends nothing when the form is empty', async () => {
    const fixture = await render();
    submit(fixture);
    await fixture.whenStable();
    expect(text(fixture)).toContain('This is required.');
    expect(text(fixture)).toContain('Enter your password.');
    http.expectNone('/api/auth/login');
  });

  it('submits the credentials and opens the page it was sent from', async () => {
    const fixture = await render('/roster');
    type(fixture, 'input[type=email]', 'dana.keel@ironvale.test');
    type(fixture, 'input[formcontrolname=password]', 'anvil-strong-77');
    submit(fixture);

    const request = http.expectOne('/api/auth/login');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'dana.keel@ironvale.test', password: 'anvil-strong-77' });
    request.flush(sessionFor('coach'));
    await fixture.whenStable();

    expect(router.url).toBe('/roster');
    expect(TestBed.inject(AuthStore).user()?.name).toBe('Dana Keel');
  });

  it('shows the server message for wrong credentials and stays on the page', async () => {
    const fixture = await render('/roster');
    type(fixture, 'input[type=email]', 'dana.keel@ironvale.test');
    type(fixture, 'input[formcontrolname=password]', 'not-the-password');
    submit(fixture);

    http
      .expectOne('/api/auth/login')
      .flush(
        { error: { code: 'invalid_credentials', message: 'That e-mail address and password do not match.' } },
        { status: 401, statusText: 'Unauthorized' },
      );
    await fixture.whenStable();

    const problem = fixture.nativeElement.querySelector('[data-testid=sign-in-problem]') as HTMLElement;
    expect(problem.textContent).toContain('That e-mail address and password do not match.');
    expect(router.url).toBe('/sign-in?next=%2Froster');
    expect(TestBed.inject(AuthStore).isSignedIn()).toBe(false);
  });

  it('shows the throttle message, which says when to try again', async () => {
    const fixture = await render();
    type(fixture, 'input[type=email]', 'dana.keel@ironvale.test');
    type(fixture, 'input[formcontrolname=password]', 'guess-number-six');
    submit(fixture);

    http
      .expectOne('/api/auth/login')
      .flush(
        { error: { code: 'too_many_requests', message: 'Too many sign-in attempts. Try again in 14 minutes.' } },
        { status: 429, statusText: 'Too Many Requests' },
      );
    await fixture.whenStable();

    expect(text(fixture)).toContain('Too many sign-in attempts. Try again in 14 minutes.');
    const button = fixture.nativeElement.querySelector('button[type=submit]') as HTMLButtonElement;
    expect(button.disabled).toBe(false);
  });

  it('ignores a next address that leaves the app', async () => {
    const fixture = await render('//elsewhere.test/phish');
    type(fixture, 'input[type=email]', 'dana.keel@ironvale.test');
    type(fixture, 'input[formcontrolname=password]', 'anvil-strong-77');
    submit(fixture);
    http.expectOne('/api/auth/login').flush(sessionFor('admin'));
    await fixture.whenStable();
    expect(router.url).toBe('/');
  });

  it('only shows notices it knows', async () => {
    const fixture = await render();
    fixture.componentRef.setInput('notice', 'joined');
    await fixture.whenStable();
    expect(text(fixture)).toContain('Your account is ready.');
    fixture.componentRef.setInput('notice', 'Call 555-0100 to verify your account');
    await fixture.whenStable();
    expect(text(fixture)).not.toContain('555-0100');
  });
});
