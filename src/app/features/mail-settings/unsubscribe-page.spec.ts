import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { waitFor } from '../../../testing/wait-for';
import { listOfToken } from './mail-lists';
import { UnsubscribePage } from './unsubscribe-page';

describe('UnsubscribePage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<UnsubscribePage>;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function open(token: string | null): Promise<void> {
    fixture = TestBed.createComponent(UnsubscribePage);
    if (token !== null) fixture.componentRef.setInput('token', token);
    await fixture.whenStable();
  }

  const element = () => fixture.nativeElement as HTMLElement;
  const button = () => element().querySelector<HTMLButtonElement>('button.submit');

  it('says which list the link stops and sends nothing until the button is pressed, then once', async () => {
    await open('12.digest.c2lnbmF0dXJl');
    TestBed.tick();
    expect(http.match(() => true)).toHaveLength(0);
    expect(element().textContent).toContain('“New coaching points”');

    button()!.click();
    button()?.click(); // a second tap while sending does nothing
    await fixture.whenStable();
    const requests = http.match('/api/mail/unsubscribe');
    expect(requests).toHaveLength(1);
    expect(requests[0].request.method).toBe('POST');
    expect(requests[0].request.body).toEqual({ token: '12.digest.c2lnbmF0dXJl' });
    requests[0].flush({ list: 'digest' });
    await fixture.whenStable();
    expect(element().querySelector('[role=status]')?.textContent).toContain('You will not get “New coaching points” mails any more.');
    expect(button()).toBeNull();
  });

  it('shows a refused link and offers no button to try the same link again', async () => {
    await open('12.weekly.forged');
    expect(element().textContent).toContain('“Weekly summary”');
    button()!.click();
    const request = await waitFor(() => http.match('/api/mail/unsubscribe')[0], 'the request');
    request.flush({ error: { code: 'token_invalid', message: 'This unsubscribe link is not valid.' } }, { status: 400, statusText: 'Bad Request' });
    await fixture.whenStable();
    expect(element().querySelector('[role=alert]')?.textContent).toContain('This unsubscribe link is not valid.');
    expect(button()).toBeNull();
  });

  it('explains an incomplete link without a token', async () => {
    await open(null);
    expect(element().textContent).toContain('This link is incomplete');
    expect(button()).toBeNull();
  });

  it('reads the list out of the token only when it is one of ours', () => {
    expect(listOfToken('5.weekly.abc')).toBe('weekly');
    expect(listOfToken('5.digest.abc')).toBe('digest');
    expect(listOfToken('5.other.abc')).toBeNull();
    expect(listOfToken(undefined)).toBeNull();
  });
});
