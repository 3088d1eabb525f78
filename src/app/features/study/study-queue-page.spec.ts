import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { waitFor } from '../../../testing/wait-for';
import { StudyQueuePage } from './study-queue-page';
import { myClip, queuePoint, snapGrade } from './study-test-data';

describe('StudyQueuePage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<StudyQueuePage>;

  const CLIPS = [
    myClip({
      clipId: 41,
      snapOrder: 7,
      watchedFraction: 0.4,
      grade: snapGrade({
        result: 'minus',
        marks: [
          { key: 'assignment', label: 'Assignment', mark: 'right' },
          { key: 'footwork', label: 'Footwork', mark: 'minus' },
          { key: 'hands', label: 'Hands', mark: null },
          { key: 'padLevel', label: 'Pad level', mark: 'plus' },
          { key: 'effort', label: 'Effort', mark: 'loaf' },
        ],
      }),
      comments: [
        queuePoint({ id: 1, acknowledged: false }),
        queuePoint({ id: 2, acknowledged: true, kind: 'praise' }),
        queuePoint({ id: 3, acknowledged: false, kind: 'teaching' }),
        // His own question is no coaching point.
        queuePoint({ id: 4, acknowledged: true, kind: 'question' }),
      ],
    }),
    myClip({ clipId: 52, sessionId: 4, sessionTitle: 'Tuesday practice', sessionDate: '2026-09-15', snapOrder: 3, angle: 'end_zone', watchedFraction: 1, comments: [queuePoint({ id: 5, acknowledged: true })], grade: snapGrade() }),
    myClip({ clipId: 42, snapOrder: 9, watchedFraction: 0, comments: [] }),
  ];

  /** The queue as the API answers it; grades travel only while the staff shares them. */
  async function load(gradesShared: boolean) {
    fixture = TestBed.createComponent(StudyQueuePage);
    const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match(url)[0]), url)).flush(body);
    await answer('/api/me/clips', { clips: gradesShared ? CLIPS : CLIPS.map((c) => ({ ...c, grade: null })), gradesShared });
    await answer('/api/me/cutups', { cutups: [{ id: 9, title: 'Pad level vs bear fronts', description: 'Watch your hat', updatedAt: '2026-09-14T10:00:00.000Z' }] });
    await fixture.whenStable();
  }

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const text = (node: Element | null) => (node?.textContent ?? '').replace(/\s+/g, ' ').trim();

  it('lists his clips by session, each with its new points, what he acknowledged and how much he watched', async () => {
    await load(true);
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

  it('shows the cut-ups shared with him', async () => {
    await load(false);
    const link = element().querySelector('[data-testid=shared-cutup]');
    expect(link?.getAttribute('href')).toBe('/study/cutups/9');
    expect(text(link)).toContain('Pad level vs bear fronts');
  });

  it('with grades shared, shows his grade on each snap in words and symbols, and links each session to his grade sheet', async () => {
    await load(true);
    const cards = Array.from(element().querySelectorAll('[data-testid=study-clip]'));
    const [first, second, third] = cards;
    expect(text(first!.querySelector('[data-testid=snap-result]'))).toBe('− Minus on this snap');
    // Marked parts only, each with a symbol; the word is there for screen readers, and spelled out for a miss or a loaf.
    expect(Array.from(first!.querySelectorAll('[data-testid=snap-mark]'), text)).toEqual(['✓ Assignment right', '− Footwork minus', '+ Pad level plus', '✗ Effort loaf']);
    expect(Array.from(first!.querySelectorAll('[data-testid=snap-mark]'), (m) => m.getAttribute('data-good'))).toEqual(['true', 'false', 'true', 'false']);
    expect(text(second!.querySelector('[data-testid=snap-ungraded]'))).toBe('Not graded on this snap yet');
    expect(text(third!.querySelector('[data-testid=snap-result]'))).toBe('+ Plus on this snap');
    expect(text(third)).toContain('Finish');

    const sheets = Array.from(element().querySelectorAll('[data-testid=my-sheet-link]'));
    expect(sheets.map((a) => a.getAttribute('href'))).toEqual(['/study/sheets/3', '/study/sheets/4']);
    expect(text(sheets[0]!)).toContain('My grade sheet for Week 2 vs Quarry Bend');
  });

  it('without grades shared, says nothing of grades and offers no grade sheet', async () => {
    await load(false);
    expect(element().querySelectorAll('[data-testid=snap-result], [data-testid=snap-ungraded], [data-testid=my-sheet-link]')).toHaveLength(0);
    expect(element().textContent).not.toMatch(/grade/i);
  });
});
