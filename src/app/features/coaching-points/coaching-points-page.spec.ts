import { OverlayContainer } from '@angular/cdk/overlay';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Role } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { clip, filmSession } from '../film-library/film-test-data';
import { comment } from '../study/study-test-data';
import { stubVideo } from '../study/video-stub';
import { CoachingPointsPage } from './coaching-points-page';
import { deskFor } from './points-test-data';

describe('CoachingPointsPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<CoachingPointsPage>;

  const THREADS = [
    comment({
      id: 500,
      author: { id: 7, name: 'Dana Keel', isStaff: true },
      edited: true,
      targets: [
        { playerId: 74, name: 'Dana Keel', acknowledged: true },
        { playerId: 70, name: 'Bram Oakes', acknowledged: false },
      ],
    }),
  ];

  const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match(url)[0]), url)).flush(body);

  async function render(role: Role): Promise<void> {
    TestBed.inject(AuthStore).setSession(sessionFor(role));
    fixture = TestBed.createComponent(CoachingPointsPage);
    fixture.componentRef.setInput('sessionId', '3');
    fixture.componentRef.setInput('clipId', '40');
    await answer('/api/film-sessions/3', filmSession());
    await answer('/api/clips/40', clip({ id: 40, snapId: 21 }));
    await answer('/api/clips/40/comments', { comments: THREADS });
    if (role !== 'analyst') await answer('/api/film-sessions/3/desk', deskFor());
    await fixture.whenStable();
  }

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    http.verify();
    jest.restoreAllMocks();
  });

  const element = () => fixture.nativeElement as HTMLElement;
  const video = () => element().querySelector('tw-snap-player video:not(.preload)') as HTMLVideoElement;
  const button = (label: string) => Array.from(element().querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.trim().includes(label))!;


  it('adds a point over a span for the linemen on the snap, with kind, grade part and words', async () => {
    await render('coach');
    stubVideo(video());
    video().currentTime = 3.2;
    document.body.dispatchEvent(new KeyboardEvent('keydown', { key: 'p', bubbles: true, cancelable: true }));
    await fixture.whenStable();
    expect(element().querySelector('[data-testid=point-start]')?.textContent).toBe('0:03.2');
    expect(document.activeElement?.getAttribute('data-testid')).toBe('point-body');

    video().currentTime = 5;
    video().dispatchEvent(new Event('timeupdate'));
    await fixture.whenStable();
    button('End here').click();
    await fixture.whenStable();
    expect(element().querySelector('[data-testid=point-end]')?.textContent).toBe('0:05.0');

    // The linemen on snap 21, left to right, are picked already.
    expect(element().querySelector('tw-point-form mat-select')?.textContent).toContain('#70 Bram Oakes, #74 Dana Keel');

    button('Fix this').click();
    const partSelect = element().querySelectorAll<HTMLElement>('tw-point-form mat-select')[1];
    partSelect.querySelector<HTMLElement>('.mat-mdc-select-trigger')!.click();
    await fixture.whenStable();
    const overlay = TestBed.inject(OverlayContainer).getContainerElement();
    Array.from(overlay.querySelectorAll<HTMLElement>('mat-option')).find((o) => o.textContent?.trim() === 'Pad level')!.click();
    await fixture.whenStable();

    const body = element().querySelector<HTMLTextAreaElement>('[data-testid=point-body]')!;
    body.value = '  Hands inside, thumbs up.  ';
    body.dispatchEvent(new Event('input'));
    button('Add point').click();

    const sent = await waitFor(() => http.match((r) => r.method === 'POST' && r.url === '/api/clips/40/comments')[0], 'the new point');
    expect(sent.request.body).toEqual({ playerIds: [70, 74], atMs: 3200, endMs: 5000, kind: 'correction', component: 'padLevel', body: 'Hands inside, thumbs up.' });
    sent.flush(comment({ id: 601 }));
    await answer('/api/clips/40/comments', { comments: THREADS });
  });

  it('refuses a span that ends before it starts', async () => {
    await render('coach');
    stubVideo(video());
    video().currentTime = 4;
    document.body.dispatchEvent(new KeyboardEvent('keydown', { key: 'P', bubbles: true, cancelable: true }));
    video().currentTime = 2;
    video().dispatchEvent(new Event('timeupdate'));
    await fixture.whenStable();
    button('End here').click();
    const body = element().querySelector<HTMLTextAreaElement>('[data-testid=point-body]')!;
    body.value = 'Too late off the ball.';
    body.dispatchEvent(new Event('input'));
    button('Add point').click();
    await fixture.whenStable();
    expect(element().textContent).toContain('The span must end after it starts.');
    expect(http.match((r) => r.method === 'POST')).toHaveLength(0);
  });

  it('shows who got each point, marks edits, and offers edit and remove on his own', async () => {
    await render('coach');
    const thread = element().querySelector('[data-testid=thread]')!;
    const text = (thread.textContent ?? '').replace(/\s+/g, ' ');
    expect(text).toContain('Dana Keel, got it');
    expect(text).toContain('Bram Oakes, not yet');
    expect(text).toContain('1 of 2 got it');
    expect(text).toContain('edited');
    expect(thread.querySelector('[aria-label="Edit this point"]')).not.toBeNull();
    expect(thread.querySelector('[aria-label="Remove this point"]')).not.toBeNull();
  });

  it('shows the safety caution beside the points on the clip', async () => {
    await render('coach');
    expect(element().querySelector('section.threads tw-safety-note [role=note]')?.textContent).toContain('Safety:');
  });

  it('gives an analyst the threads but no form and no desk request', async () => {
    await render('analyst');
    expect(element().querySelector('tw-point-form')).toBeNull();
    expect(element().textContent).toContain('Coaches write coaching points');
    expect(element().querySelectorAll('[data-testid=thread]')).toHaveLength(1);
  });
});
