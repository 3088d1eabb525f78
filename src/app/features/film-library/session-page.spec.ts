import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { waitFor } from '../../../testing/wait-for';
import { TAG_ITEMS, clip, filmSession, pressKey, snap } from './film-test-data';
import { SessionPage } from './session-page';

describe('SessionPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<SessionPage>;

  const SNAPS = [
    snap({ id: 21, order: 1, conceptId: 101, clips: [{ id: 40, angle: 'sideline', status: 'processing', posterUrl: null }] }),
    snap({ id: 22, order: 2, clips: [{ id: 41, angle: 'sideline', status: 'ready', posterUrl: '/api/clips/41/poster' }] }),
  ];
  const CLIPS = [
    clip({ id: 40, snapId: 21, status: 'processing', progress: 45, playbackUrl: null, posterUrl: null }),
    clip({ id: 41, snapId: 22 }),
    clip({ id: 43, snapId: 22, angle: 'end_zone' }),
    clip({ id: 42, snapId: null, status: 'failed', failureReason: 'the file ends before its video does', originalName: 'play_003.mp4' }),
  ];

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(HTMLMediaElement.prototype, 'pause').mockImplementation(() => undefined);
    fixture = TestBed.createComponent(SessionPage);
    fixture.componentRef.setInput('sessionId', '3');
    const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match(url)[0]), url)).flush(body);
    await answer('/api/film-sessions/3', filmSession({ snapCount: 2 }));
    await answer('/api/film-sessions/3/snaps', { snaps: SNAPS });
    await answer('/api/film-sessions/3/clips', { clips: CLIPS });
    await answer('/api/teams/1/tag-lists', { items: TAG_ITEMS });
    await fixture.whenStable();
  });

  afterEach(() => {
    // Clip 40 is still processing, so a slow run may see the next 2-second poll.
    http.match('/api/film-sessions/3/clips');
    http.verify();
    jest.restoreAllMocks();
  });

  const element = () => fixture.nativeElement as HTMLElement;
  const rows = () => Array.from(element().querySelectorAll('[data-testid=snap-row]'), (r) => (r.textContent ?? '').replace(/\s+/g, ' ').trim());

  it('shows each snap with its angles, live clip states and play data, and the clips that need a hand', () => {
    const [first, second] = rows();
    expect(first).toContain('Processing 45%');
    expect(first).toContain('inside zone');
    expect(second).toContain('Sideline');
    expect(second).toContain('End zone');
    expect(second).toContain('No tags yet');
    const failed = element().querySelector('[data-testid=failed-clip]')?.textContent ?? '';
    expect(failed).toContain('play_003.mp4');
    expect(failed).toContain('the file ends before its video does');
    expect(element().querySelector('.facts')?.textContent).toContain('1 failed');
  });

  it('saves the typed tags before J moves to the next snap, whose angles go to the player', async () => {
    expect(element().querySelector('tw-snap-player')?.textContent).toContain('No playable video here yet');
    pressKey('4');
    await fixture.whenStable();
    pressKey('j');
    const save = await waitFor(() => http.match('/api/snaps/21')[0], 'the save');
    expect(save.request.body).toEqual({ down: 4 });
    save.flush({ ...SNAPS[0], down: 4 });
    await waitFor(() => element().querySelector('li.focus')?.id === 'snap-option-22', 'the move to snap 2');
    await fixture.whenStable();
    expect(rows()[0]).toContain('4th');
    const video = element().querySelector('tw-snap-player video:not(.preload)');
    expect(video?.getAttribute('src')).toBe('/api/clips/41/playback');
    expect(element().querySelector('tw-snap-player')?.textContent).toContain('End zone');
  });

  it('selects a range with shift-click for bulk tags', async () => {
    const [, second] = Array.from(element().querySelectorAll<HTMLElement>('[data-testid=snap-row]'));
    second.dispatchEvent(new MouseEvent('click', { shiftKey: true, bubbles: true }));
    await waitFor(() => element().textContent?.includes('2 snaps (1–2)'), 'the bulk panel');
    expect(element().querySelectorAll('li[aria-selected=true]')).toHaveLength(2);
  });
});
