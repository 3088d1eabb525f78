import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { waitFor } from '../../../testing/wait-for';
import { MailSettingsPage } from './mail-settings-page';

describe('MailSettingsPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<MailSettingsPage>;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(MailSettingsPage);
    (await waitFor(() => (TestBed.tick(), http.match('/api/me/mail-preferences')[0]), 'the preferences')).flush({ coachingDigest: true, digestEveryHours: 1, weeklySummary: true });
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;

  it('turns the weekly summary off and the digest to once a day, and saves both', async () => {
    element().querySelectorAll<HTMLButtonElement>('mat-slide-toggle button')[1].click();
    const daily = Array.from(element().querySelectorAll<HTMLInputElement>('mat-radio-button input')).find((i) => i.value === '24')!;
    daily.click();
    await fixture.whenStable();
    expect(element().textContent).toContain('Off: mail me the weekly summary');
    Array.from(element().querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Save'))!.click();
    const put = await waitFor(() => http.match((r) => r.method === 'PUT' && r.url === '/api/me/mail-preferences')[0], 'the save');
    expect(put.request.body).toEqual({ coachingDigest: true, digestEveryHours: 24, weeklySummary: false });
    put.flush({ coachingDigest: true, digestEveryHours: 24, weeklySummary: false });
    await fixture.whenStable();
    expect(element().querySelector('.saved')?.textContent).toContain('Saved');
  });

  it('cannot choose how often while the digest is off', async () => {
    element().querySelectorAll<HTMLButtonElement>('mat-slide-toggle button')[0].click();
    await fixture.whenStable();
    const radios = Array.from(element().querySelectorAll<HTMLInputElement>('mat-radio-button input'));
    expect(radios.every((r) => r.disabled)).toBe(true);
  });
});
