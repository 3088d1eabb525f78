import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { StudyClipPage, atParam } from './study-clip-page';
import { comment, myClip, queuePoint } from './study-test-data';
import { stubVideo } from './video-stub';

describe('StudyClipPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<StudyClipPage>;

  const THREADS = [
    comment({ id: 500, atMs: 1200, body: 'Stay low out of your stance.' }),
    comment({ id: 501, atMs: 5400, endMs: 6800, kind: 'praise', component: null, body: 'Great finish, run your feet like this.', replies: [comment({ id: 502, parentId: 501, kind: 'reply', body: 'Thanks coach', author: { id: 7, name: 'Dana Keel', isStaff: false }, targets: [] })] }),
  ];

  const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match(url)[0]), url)).flush(body);

  async function render(at: string | null): Promise<void> {
    TestBed.inject(AuthStore).setSession(sessionFor('player'));
    fixture = TestBed.createComponent(StudyClipPage);
    fixture.componentRef.setInput('clipId', '40');
    if (at !== null) fixture.componentRef.setInput('at', at);
    await answer('/api/me/clips', { clips: [myClip({ clipId: 40, comments: [queuePoint({ id: 500 }), queuePoint({ id: 501, kind: 'praise' })] })] });
    await answer('/api/clips/40/comments', { comments: THREADS });
    await fixture.whenStable();
    stubVideo(video());
  }

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    fixture.destroy();
    http.verify();
    jest.restoreAllMocks();
  });

  const element = () => fixture.nativeElement as HTMLElement;
  const video = () => element().querySelector('tw-snap-player video:not(.preload)') as HTMLVideoElement;
  const threadTexts = () => Array.from(element().querySelectorAll('[data-testid=thread]'), (t) => (t.textContent ?? '').replace(/\s+/g, ' ').trim());

  it('starts the video at ?at= once it can seek', async () => {
    await render('3200');
    expect(video().getAttribute('src')).toBe('/api/clips/40/playback');
    video().dispatchEvent(new Event('loadedmetadata'));
    await fixture.whenStable();
    expect(video().currentTime).toBeCloseTo(3.2, 9);
  });

  it('reads ?at= as whole milliseconds only', () => {
    expect(atParam('3200')).toBe(3200);
    expect(atParam('-5')).toBeUndefined();
    expect(atParam('abc')).toBeUndefined();
    expect(atParam(undefined)).toBeUndefined();
  });

  it('lists his points with kind, author and replies, and a marker plays from its moment', async () => {
    await render(null);
    const [first, second] = threadTexts();
    expect(first).toContain('Fix this');
    expect(first).toContain('Pad level');
    expect(first).toContain('Coach Harlan Voss');
    expect(first).toContain('Stay low out of your stance.');
    expect(second).toContain('Keep doing this');
    expect(second).toContain('0:05.4–0:06.8');
    expect(second).toContain('Thanks coach');

    const markers = element().querySelectorAll<HTMLButtonElement>('tw-point-markers button[data-marker]');
    expect(markers).toHaveLength(2);
    expect(markers[1].getAttribute('aria-label')).toContain('Play from 0:05.4–0:06.8, Keep doing this');
    const play = jest.spyOn(video(), 'play');
    markers[1].click();
    await fixture.whenStable();
    expect(video().currentTime).toBeCloseTo(5.4, 9);
    expect(play).toHaveBeenCalled();
  });

  it('shows the safety caution with his coaching points', async () => {
    await render(null);
    expect(element().querySelector('section.points tw-safety-note [role=note]')?.textContent).toContain('Safety:');
  });

  it('says "Got it" with a POST and then shows the point as acknowledged', async () => {
    await render(null);
    const gotIt = Array.from(element().querySelectorAll<HTMLButtonElement>('[data-testid=thread] button')).find((b) => b.textContent?.includes('Got it'));
    gotIt!.click();
    const ack = await waitFor(() => http.match('/api/comments/500/acknowledge')[0], 'the acknowledge request');
    expect(ack.request.method).toBe('POST');
    ack.flush(null, { status: 204, statusText: 'No Content' });
    await answer('/api/clips/40/comments', { comments: [comment({ id: 500, targets: [{ playerId: 74, name: 'Dana Keel', acknowledged: true }] }), THREADS[1]] });
    await fixture.whenStable();
    expect(element().querySelector('[data-testid=thread] [data-testid=acknowledged]')?.textContent).toContain('You got it');
  });

  it('reports the stretch he played when he pauses', async () => {
    await render(null);
    video().currentTime = 3.2;
    video().dispatchEvent(new Event('play'));
    for (const t of [3.6, 4.0, 4.4, 4.8]) {
      video().currentTime = t;
      video().dispatchEvent(new Event('timeupdate'));
    }
    video().dispatchEvent(new Event('pause'));
    const report = await waitFor(() => http.match('/api/clips/40/views')[0], 'the view report');
    expect(report.request.method).toBe('POST');
    expect(report.request.body).toEqual({ fromMs: 3200, toMs: 4800 });
    report.flush({ watchedFraction: 0.2 });
    await fixture.whenStable();
    expect(element().querySelector('.head tw-watched-meter')?.textContent).toContain('20 % watched');
  });

  it('asks a question at the moment the video is at', async () => {
    await render(null);
    video().currentTime = 2.5;
    video().dispatchEvent(new Event('timeupdate'));
    await fixture.whenStable();
    const ask = Array.from(element().querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Ask a question'));
    ask!.click();
    await fixture.whenStable();
    const box = element().querySelector<HTMLTextAreaElement>('form.question textarea')!;
    box.value = 'Which foot steps first here?';
    box.dispatchEvent(new Event('input'));
    element().querySelector<HTMLFormElement>('form.question')!.dispatchEvent(new Event('submit'));
    const sent = await waitFor(() => http.match('/api/clips/40/questions')[0], 'the question');
    expect(sent.request.body).toEqual({ atMs: 2500, body: 'Which foot steps first here?' });
    sent.flush(comment({ id: 600, kind: 'question', atMs: 2500 }));
    await answer('/api/clips/40/comments', { comments: THREADS });
  });
});
