import { Component } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { InvitationPreview } from '@shared/api/auth';
import { JoinPage } from './join-page';

@Component({ template: '' })
class Blank {}

const TOKEN = 'k3y-0f-the-invitation-0123456789';

describe('JoinPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'sign-in', component: Blank }]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function render(preview: InvitationPreview | 'invalid'): Promise<ComponentFixture<JoinPage>> {
    const fixture = TestBed.createComponent(JoinPage);
    fixture.componentRef.setInput('token', TOKEN);
    fixture.detectChanges();
    const request = http.expectOne(`/api/invitations/${TOKEN}`);
    if (preview === 'invalid') {
      request.flush(
        { error: { code: 'token_invalid', message: 'This invitation link is invalid, used or expired.' } },
        { status: 400, statusText: 'Bad Request' },
      );
    } else {
      request.flush(preview);
    }
    await fixture.whenStable();
    return fixture;
  }

  function type(fixture: ComponentFixture<JoinPage>, selector: string, value: string): void {
    const input = fixture.nativeElement.querySelector(selector) as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  const text = (fixture: ComponentFixture<JoinPage>) => (fixture.nativeElement as HTMLElement).textContent ?? '';

  it('shows what the invitation is for and creates the sign-in', async () => {
    const fixture = await render({ email: 'rowan.pike@ironvale.test', teamName: 'Ironvale Anvils', role: 'player', playerName: 'Rowan Pike', hasAccount: false });
    expect(text(fixture)).toContain('Ironvale Anvils');
    expect(text(fixture)).toContain('Player');
    expect(text(fixture)).toContain('Rowan Pike');

    type(fixture, 'input[formcontrolname=name]', '  Rowan Pike ');
    type(fixture, 'input[formcontrolname=password]', 'football');
    await fixture.whenStable();
    expect(text(fixture)).toContain('That password is too common; choose another.');

    type(fixture, 'input[formcontrolname=password]', 'pulling-guard-62');
    type(fixture, 'input[formcontrolname=confirm]', 'pulling-guard-62');
    (fixture.nativeElement.querySelector('button[type=submit]') as HTMLButtonElement).click();
    const accept = http.expectOne('/api/invitations/accept');
    expect(accept.request.body).toEqual({ token: TOKEN, name: 'Rowan Pike', password: 'pulling-guard-62' });
    accept.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe('/sign-in?notice=joined');
  });

  it('asks an existing account for its password only', async () => {
    const fixture = await render({ email: 'mara.voss@ironvale.test', teamName: 'Ironvale Anvils JV', role: 'coordinator', hasAccount: true });
    expect(fixture.nativeElement.querySelector('input[formcontrolname=name]')).toBeNull();
    type(fixture, 'input[formcontrolname=password]', 'my-old-password');
    (fixture.nativeElement.querySelector('button[type=submit]') as HTMLButtonElement).click();
    http
      .expectOne('/api/invitations/accept')
      .flush(
        { error: { code: 'validation_failed', message: 'Enter the password of your existing Trenchwork account.', fields: { password: 'Not the password of this account.' } } },
        { status: 422, statusText: 'Unprocessable Entity' },
      );
    await fixture.whenStable();
    expect(text(fixture)).toContain('Not the password of this account.');
  });

  it('explains a dead link', async () => {
    const fixture = await render('invalid');
    expect(text(fixture)).toContain('This invitation link is invalid, used or expired.');
    expect(fixture.nativeElement.querySelector('form')).toBeNull();
  });
});
