import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { waitFor } from '../../../testing/wait-for';
import { StudyQueuePage } from './study-queue-page';
import { myClip, queuePoint } from './study-test-data';

describe('StudyQueuePage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<StudyQueuePage>;

  const CLIPS = [
    myClip({
      clipId: 41,
      snapOrder: 7,
      watchedFraction: 0.4,
      comments: [
        queuePoint({ id: 1, acknowledged: false }),
        queuePoint({ id: 2, acknowledged: true, kind: 'praise' }),
        queuePoint({ id: 3, acknowledged: false, kind: 'teaching' }),
        // His own question is no coaching point.
        queuePoint({ id: 4, acknowledged: true, kind: 'question' }),
      ],
    }),
    myClip({ clipId: 52, sessionId: 4, sessionTitle: 'Tuesday practice', sessionDate: '2026-09-15', snapOrder: 3, angle: 'end_zone', watchedFraction: 1, comments: [queuePoint({ id: 5, acknowledged: true })] }),
    myClip({ clipId: 42, snapOrder: 9, watchedFraction: 0, comments: [] }),
  ];

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(StudyQueuePage);
    const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match(url)[0]), url)).flush(body);
    await answer('/api/me/clips', { clips: CLIPS });
    await answer('/api/me/cutups', { cutups: [{ id: 9, title: 'Pad level vs bear fronts', description: 'Watch your hat', updatedAt: '2026-09-14T10:00:00.000Z' }] });
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const text = (node: Element | null) => (node?.textContent ?? '').replace(/\s+/g, ' ').trim();

  it('lists his clips by session, each with its new points, what he acknowledged and how much he watched', () => {
    const sessions = Array.from(element().querySelectorAll('section.session h3'), (h) => text(h));
    expect(sessions[0]).toContain('Week 2 vs Quarry Bend');
    expect(sessions[1]).toContain('Tuesday practice');

    const cards = Array.from(element().querySelectorAll('[data-testid=study-clip]'));
    expect(cards.map((c) => c.getAttribute('href'))).toEqual(['/study/clips/41', '/study/clips/42', '/study/clips/52']);

    const [first, second, third] = cards.map(text);
    expect(first).toContain('Snap 7 · Sideline');
    expect(first).toContain('2 new');
    expect(first).toContain('1 of 3 points got it');
    expect(first).toContain('40 % watched');

    expect(second).toContain('No coaching points for you');
    expect(second).toContain('Not watched yet');

    expect(third).toContain('Snap 3 · End zone');
    expect(third).toContain('All got it · 1 of 1 point');
    expect(third).toContain('Watched (100 %)');

    expect(text(element().querySelector('.summary'))).toBe('2 new points to read, 2 clips to watch.');
  });

  it('shows the cut-ups shared with him', () => {
    const link = element().querySelector('[data-testid=shared-cutup]');
    expect(link?.getAttribute('href')).toBe('/study/cutups/9');
    expect(text(link)).toContain('Pad level vs bear fronts');
  });
});
