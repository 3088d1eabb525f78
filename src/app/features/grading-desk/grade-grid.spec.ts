import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Grade, GradeInput } from '@shared/api/grading';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { GradeGrid } from './grade-grid';
import { GRADE_RETRY_BASE_MS, GRADE_SAVE_DELAY_MS, GradeSaveQueue } from './grade-save-queue';
import { LINE, grade, press, scheme } from './grading-test-data';
import { queueStorageKey } from './queued-grade';

const ALL_PLUS: Omit<GradeInput, 'version'> = {
  assignment: 'right',
  missedReason: null,
  footwork: 'plus',
  hands: 'plus',
  padLevel: 'plus',
  extra: { finish: 'plus' },
  effort: 'plus',
  knockdowns: 0,
  pressuresAllowed: 0,
  sacksAllowed: 0,
  penalties: [],
  note: null,
};

describe('GradeGrid', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<GradeGrid>;

  function configure(): void {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        // No rest between key and save, and no timed retry: the tests decide when the server is back.
        { provide: GRADE_SAVE_DELAY_MS, useValue: 0 },
        { provide: GRADE_RETRY_BASE_MS, useValue: 600_000 },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).setSession(sessionFor('coach'));
  }

  async function render(): Promise<void> {
    TestBed.inject(GradeSaveQueue).start();
    fixture = TestBed.createComponent(GradeGrid);
    fixture.componentRef.setInput('sessionId', 3);
    fixture.componentRef.setInput('snapId', 21);
    fixture.componentRef.setInput('snapOrder', 1);
    fixture.componentRef.setInput('players', LINE);
    fixture.componentRef.setInput('scheme', scheme());
    await fixture.whenStable();
    fixture.componentInstance.focus();
  }

  beforeEach(async () => {
    localStorage.clear();
    configure();
    await render();
  });

  afterEach(() => {
    http.verify();
    localStorage.clear();
  });

  const element = () => fixture.nativeElement as HTMLElement;
  const rowText = (playerId: number) => (element().querySelector(`tr[data-player="${playerId}"]`)?.textContent ?? '').replace(/\s+/g, ' ').trim();
  const nextPut = () => waitFor(() => http.match((r) => r.method === 'PUT')[0], 'a grade PUT');
  const saved = (req: TestRequest, version = 1): Grade => {
    const body = req.request.body as GradeInput;
    const [, snapId, , playerId] = req.request.url.split('/').slice(2);
    const answer = grade({ ...body, snapId: Number(snapId), playerId: Number(playerId), version, result: 'plus' });
    req.flush(answer);
    return answer;
  };

  it('grades five linemen all plus with five keystrokes: one PUT per row, in order, with the right bodies', async () => {
    let keystrokes = 0;
    for (let i = 0; i < 5; i++) {
      const event = press('p');
      keystrokes += 1;
      expect(event.defaultPrevented).toBe(true);
    }
    expect(keystrokes).toBe(5);
    // The grid shows the marks (symbol and word) before any server answer.
    await fixture.whenStable();
    expect(rowText(11)).toContain('✓ right');
    expect(rowText(15)).toContain('+ plus');

    for (const player of LINE) {
      const req = await nextPut();
      expect(req.request.url).toBe(`/api/snaps/21/grades/${player.playerId}`);
      expect(req.request.body).toEqual({ ...ALL_PLUS, version: 0 });
      saved(req);
    }
    http.expectNone((r) => r.method === 'PUT');
    await fixture.whenStable();
    expect(element().querySelectorAll('.state[data-state="saved"]')).toHaveLength(5);
    expect(rowText(13)).toContain('Also graded by Cal Dorsey');
  });

  it('takes one correction in eight keystrokes: minus on the right guard\'s hands, the rest plus', async () => {
    // p p p (LT, LG, C), → → (to Hands on RG), −, f (rest of RG plus), p (RT).
    for (const key of ['p', 'p', 'p', 'ArrowRight', 'ArrowRight', '-', 'f', 'p']) press(key);
    const bodies = new Map<string, GradeInput>();
    for (let i = 0; i < 5; i++) {
      const req = await nextPut();
      bodies.set(req.request.url, req.request.body as GradeInput);
      saved(req);
    }
    expect(bodies.get('/api/snaps/21/grades/14')).toEqual({ ...ALL_PLUS, hands: 'minus', version: 0 });
    expect(bodies.get('/api/snaps/21/grades/15')).toEqual({ ...ALL_PLUS, version: 0 });
    await fixture.whenStable();
    // The live result follows the strict rule: a minus part makes the snap minus, in words.
    expect(element().querySelector('tr[data-player="14"] td[data-col="result"]')?.textContent).toContain('− minus');
  });

  it('sets marks, missed reasons, loaf and counts from the keys of the map', async () => {
    // On LT: m then 2 (second reason), then to Effort and l, then Knockdowns 1 2 → 12.
    press('m');
    press('2');
    for (let i = 0; i < 5; i++) press('ArrowRight');
    press('l');
    press('ArrowRight');
    press('1');
    press('2');
    const req = await nextPut();
    expect(req.request.body).toMatchObject({ assignment: 'missed', missedReason: 'wrong call', effort: 'loaf', knockdowns: 12, version: 0 });
    saved(req);
    await fixture.whenStable();
    expect(rowText(11)).toContain('✗ missed');
    expect(rowText(11)).toContain('wrong call');
    expect(rowText(11)).toContain('⊘ loaf');
  });

  it('shows a 409 with both values and resends mine over the server version on "Keep mine"', async () => {
    press('p');
    const first = await nextPut();
    first.flush(
      { error: { code: 'stale_version', message: 'Someone saved this grade first.', current: grade({ version: 3, assignment: 'right', hands: 'minus', graderName: 'Dana Keel' }) } },
      { status: 409, statusText: 'Conflict' },
    );
    await waitFor(() => element().querySelector('[data-testid=conflict]'), 'the conflict choice');
    await fixture.whenStable();
    const conflict = element().querySelector('[data-testid=conflict]') as HTMLElement;
    expect(conflict.textContent).toContain('version 3');
    // Hands differ: mine plus, the server's minus, both in words.
    const mine = Array.from(conflict.querySelectorAll('[data-testid=mine]'), (td) => td.textContent?.trim());
    const theirs = Array.from(conflict.querySelectorAll('[data-testid=theirs]'), (td) => td.textContent?.trim());
    expect(mine).toContain('+ plus');
    expect(theirs).toContain('− minus');
    expect(rowText(11)).toContain('Conflict: choose');

    (Array.from(conflict.querySelectorAll('button')).find((b) => b.textContent?.includes('Keep mine')) as HTMLButtonElement).click();
    const resend = await nextPut();
    expect(resend.request.body).toEqual({ ...ALL_PLUS, version: 3 });
    saved(resend, 4);
    await fixture.whenStable();
    expect(element().querySelector('[data-testid=conflict]')).toBeNull();
  });

  it('takes the server value on "Take the server\'s"', async () => {
    press('p');
    (await nextPut()).flush(
      { error: { code: 'stale_version', message: 'Someone saved this grade first.', current: grade({ version: 3, assignment: 'missed', missedReason: 'communication' }) } },
      { status: 409, statusText: 'Conflict' },
    );
    await waitFor(() => element().querySelector('[data-testid=conflict]'), 'the conflict choice');
    (Array.from(element().querySelectorAll('[data-testid=conflict] button')).find((b) => b.textContent?.includes('server')) as HTMLButtonElement).click();
    await fixture.whenStable();
    http.expectNone((r) => r.method === 'PUT');
    expect(rowText(11)).toContain('✗ missed');
    expect(rowText(11)).toContain('Saved');
  });

  it('keeps changes in storage while the server is unreachable and sends them in order when it answers again', async () => {
    press('p');
    const lost = await nextPut();
    lost.error(new ProgressEvent('error'), { status: 0, statusText: 'Unknown Error' });
    press('p');
    // The second row waits behind the first: nothing is sent while offline.
    await new Promise((resolve) => setTimeout(resolve, 20));
    http.expectNone((r) => r.method === 'PUT');

    const stored = JSON.parse(localStorage.getItem(queueStorageKey(7)) ?? '[]') as { playerId: number; draft: object; version: number }[];
    expect(stored.map((e) => e.playerId)).toEqual([11, 12]);
    expect(stored[0].draft).toEqual(ALL_PLUS);
    await fixture.whenStable();
    expect(rowText(11)).toContain('Waiting: offline');

    // The browser says it is online again. Each step takes every PUT pending (http.match removes
    // them all), so a change sent twice at once would show as two requests, not be dropped unseen.
    window.dispatchEvent(new Event('online'));
    const puts = () => waitFor(() => { const found = http.match((r) => r.method === 'PUT'); return found.length > 0 && found; }, 'a grade PUT');
    const firstBatch = await puts();
    expect(firstBatch.map((r) => r.request.url)).toEqual(['/api/snaps/21/grades/11']);
    expect(firstBatch[0].request.body).toEqual({ ...ALL_PLUS, version: 0 });
    saved(firstBatch[0]);
    const secondBatch = await puts();
    expect(secondBatch.map((r) => r.request.url)).toEqual(['/api/snaps/21/grades/12']);
    saved(secondBatch[0]);
    await waitFor(() => localStorage.getItem(queueStorageKey(7)) === null, 'the queue to empty');

    // Once: with the queue empty nothing further is sent, not even on another "online" event.
    await new Promise((resolve) => setTimeout(resolve, 20));
    http.expectNone((r) => r.method === 'PUT');
    window.dispatchEvent(new Event('online'));
    await new Promise((resolve) => setTimeout(resolve, 20));
    await fixture.whenStable();
    http.expectNone((r) => r.method === 'PUT');
    http.verify();
    expect(rowText(11)).toContain('Saved');
    expect(rowText(12)).toContain('Saved');
  });

  it('retries a 503 too, and a reload restores the queue over the server data and sends it', async () => {
    press('p');
    (await nextPut()).flush({ error: { code: 'service_unavailable', message: 'Try again soon.' } }, { status: 503, statusText: 'Service Unavailable' });
    await waitFor(() => (localStorage.getItem(queueStorageKey(7)) ?? '').includes('"playerId":11'), 'the stored change');

    // A reload: a new app with the same browser storage.
    TestBed.resetTestingModule();
    configure();
    await render();
    const resent = await nextPut();
    expect(resent.request.url).toBe('/api/snaps/21/grades/11');
    expect(resent.request.body).toEqual({ ...ALL_PLUS, version: 0 });
    // The server's older copy arriving late does not replace what the coach did.
    TestBed.inject(GradeSaveQueue).absorb([grade({ version: 0, assignment: 'missed' })]);
    await fixture.whenStable();
    expect(rowText(11)).toContain('✓ right');
    saved(resent);
  });

  it('is read only while grading is locked', async () => {
    fixture.componentRef.setInput('locked', true);
    await fixture.whenStable();
    const event = press('p');
    expect(event.defaultPrevented).toBe(true);
    await new Promise((resolve) => setTimeout(resolve, 20));
    http.expectNone((r) => r.method === 'PUT');
    expect(rowText(11)).toContain('○ not graded');
  });
});
