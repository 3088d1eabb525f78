import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { CutupReelPage } from './cutup-reel-page';
import type { Cutup, CutupItem } from './cutups-api';

const item = (position: number, clipId: number, note: string | null, ready = true): CutupItem => ({
  position,
  clipId,
  note,
  angle: 'sideline',
  sessionTitle: 'Week 2 vs Quarry Bend',
  snapOrder: position * 3,
  posterUrl: `/api/clips/${clipId}/poster`,
  playbackUrl: ready ? `/api/clips/${clipId}/playback` : null,
});

const CUTUP: Cutup = {
  id: 9,
  teamId: 1,
  title: 'Pad level vs bear fronts',
  description: 'Eyes on your hat',
  filter: null,
  items: [item(1, 40, 'Low out of the stance'), item(2, 41, null, false), item(3, 42, 'Finish through the whistle')],
  sharedWith: { playerIds: [], groups: ['OL'] },
};

describe('CutupReelPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<CutupReelPage>;

  beforeEach(async () => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(HTMLMediaElement.prototype, 'pause').mockImplementation(() => undefined);
    TestBed.inject(AuthStore).setSession(sessionFor('player'));
    fixture = TestBed.createComponent(CutupReelPage);
    fixture.componentRef.setInput('cutupId', '9');
    (await waitFor(() => (TestBed.tick(), http.match('/api/cutups/9')[0]), 'the cut-up')).flush(CUTUP);
    await fixture.whenStable();
  });

  afterEach(() => {
    fixture.destroy();
    http.verify();
    jest.restoreAllMocks();
  });

  const element = () => fixture.nativeElement as HTMLElement;
  const video = () => element().querySelector('tw-snap-player video:not(.preload)') as HTMLVideoElement;

  it('plays straight through: when a clip ends the next playable one starts, with its note', async () => {
    expect(video().getAttribute('src')).toBe('/api/clips/40/playback');
    expect(element().querySelector('[data-testid=reel-note]')?.textContent).toContain('Low out of the stance');
    expect(element().textContent).toContain('1 clip is not ready to play and left out.');
    expect(element().querySelector('video.preload')?.getAttribute('src')).toBe('/api/clips/42/playback');

    video().dispatchEvent(new Event('ended'));
    await fixture.whenStable();
    expect(video().getAttribute('src')).toBe('/api/clips/42/playback');
    expect(element().textContent).toContain('Clip 2 of 2');
    expect(element().querySelector('[data-testid=reel-note]')?.textContent).toContain('Finish through the whistle');

    const play = jest.spyOn(HTMLMediaElement.prototype, 'play').mockImplementation(() => Promise.resolve());
    video().dispatchEvent(new Event('loadedmetadata'));
    expect(play).toHaveBeenCalledTimes(1);
  });

  it('shows the safety caution under the clip notes, outside the announced region', () => {
    const note = element().querySelector('.watch > tw-safety-note [role=note]');
    expect(note?.textContent).toContain('Safety:');
    expect(note?.closest('[aria-live]')).toBeNull();
  });
});
