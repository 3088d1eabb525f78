import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { scheme } from './grading-test-data';
import { SchemeSettingsPage } from './scheme-settings-page';

describe('SchemeSettingsPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<SchemeSettingsPage>;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).setSession(sessionFor('coordinator'));
    fixture = TestBed.createComponent(SchemeSettingsPage);
    (await waitFor(() => (TestBed.tick(), http.match('/api/teams/1/grading-scheme')[0]), 'the scheme')).flush(scheme());
    // The sharing switches on the same page read the team (sharing-settings.spec.ts tests them).
    (await waitFor(() => http.match('/api/teams/1')[0], 'the team')).flush({ id: 1, name: 'Ironvale Anvils', currentSeasonId: null, seasons: [], sharing: { gradesWithPlayers: true, unitWithPlayers: false } });
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const button = (label: string) => Array.from(element().querySelectorAll('button')).find((b) => b.textContent?.includes(label)) as HTMLButtonElement;

  it('says a save makes a new version, adds a part, retires one, and PUTs the new scheme', async () => {
    expect(element().textContent).toContain('Saving makes version 3 for new grades');
    button('Add a part').click();
    await fixture.whenStable();
    const name = element().querySelector('input[aria-label="Name of extra part 3"]') as HTMLInputElement;
    name.value = 'Eyes / target';
    name.dispatchEvent(new Event('input'));
    button('Retire').click();
    await fixture.whenStable();
    button('Save as version 3').click();
    const put = await waitFor(() => http.match('/api/teams/1/grading-scheme').find((r) => r.request.method === 'PUT'), 'the save');
    expect(put.request.body.extraComponents).toEqual([
      { key: 'finish', label: 'Finish', active: false },
      { key: 'eyes', label: 'Eyes', active: false },
      { key: 'eyesTarget', label: 'Eyes / target', active: true },
    ]);
    put.flush(scheme({ version: 3, extraComponents: put.request.body.extraComponents }));
    await fixture.whenStable();
    expect(element().textContent).toContain('Saved as version 3.');
    expect(element().textContent).toContain('Now in use: version 3');
  });
});
