import { Location } from '@angular/common';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Desk, GradingProgress } from '@shared/api/grading';
import type { Role } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { TAG_ITEMS, clip, filmSession, snap } from '../film-library/film-test-data';
import { GRADE_RETRY_BASE_MS, GRADE_SAVE_DELAY_MS } from './grade-save-queue';
import { GradingDeskPage } from './grading-desk-page';
import { desk, grade, press, progress } from './grading-test-data';

describe('GradingDeskPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<GradingDeskPage>;

  async function render(role: Role, deskData: Desk = desk(), progressData: GradingProgress = progress()): Promise<void> {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: GRADE_SAVE_DELAY_MS, useValue: 0 },
        { provide: GRADE_RETRY_BASE_MS, useValue: 600_000 },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(HTMLMediaElement.prototype, 'pause').mockImplementation(() => undefined);
    TestBed.inject(AuthStore).setSession(sessionFor(role));
    fixture = TestBed.createComponent(GradingDeskPage);
    fixture.componentRef.setInput('sessionId', '3');
    const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match(url)[0]), url)).flush(body);
    await answer('/api/film-sessions/3/desk', deskData);
    await answer('/api/film-sessions/3', filmSession());
    await answer('/api/film-sessions/3/snaps', { snaps: [snap({ id: 21, order: 1, down: 2, distance: 7, conceptId: 101 }), snap({ id: 22, order: 2 })] });
    await answer('/api/film-sessions/3/clips', { clips: [clip({ id: 41, snapId: 21 }), clip({ id: 43, snapId: 21, angle: 'end_zone' }), clip({ id: 44, snapId: 22 })] });
    await answer('/api/film-sessions/3/grading-progress', progressData);
    await answer('/api/teams/1/tag-lists', { items: TAG_ITEMS });
    await fixture.whenStable();
  }

  afterEach(() => {
    http.verify();
    jest.restoreAllMocks();
    localStorage.clear();
  });

  const element = () => fixture.nativeElement as HTMLElement;
  const text = () => (element().textContent ?? '').replace(/\s+/g, ' ');

  it('shows the snap\'s two angles, its play data, the line and who else graded it', async () => {
    await render('coach');
    expect(text()).toContain('Snap 1 (1 of 2)');
    const player = element().querySelector('tw-snap-player') as HTMLElement;
    expect(player.querySelector('video:not(.preload)')?.getAttribute('src')).toBe('/api/clips/41/playback');
    expect(player.textContent).toContain('End zone');
    expect(element().querySelector('tw-play-data-strip')?.textContent).toContain('2nd & 7');
    expect(element().querySelectorAll('tw-grade-grid tbody tr[data-player]')).toHaveLength(5);
    expect(element().querySelector('[data-testid=other-graders]')?.textContent).toContain('Cal Dorsey (1 lineman)');
    // The legend on screen follows the key map.
    expect(element().querySelector('details.keys')?.textContent).toContain('Whole row plus');
    // Coaches see no lock button.
    expect(text()).not.toContain('Lock grading');
  });

  it('grades with the keyboard, then PageDown goes to the next snap and keeps it in the address', async () => {
    await render('coach');
    await waitFor(() => document.activeElement?.getAttribute('role') === 'gridcell', 'the grid to take the keyboard');
    press('p');
    const put = await waitFor(() => http.match((r) => r.method === 'PUT')[0], 'the save');
    expect(put.request.url).toBe('/api/snaps/21/grades/11');
    put.flush(grade({ assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', extra: { finish: 'plus' }, effort: 'plus', result: 'plus' }));

    press('PageDown');
    await fixture.whenStable();
    expect(text()).toContain('Snap 2 (2 of 2)');
    expect(TestBed.inject(Location).path()).toContain('snap=22');
    expect(element().querySelector('tw-snap-player video:not(.preload)')?.getAttribute('src')).toBe('/api/clips/44/playback');
    await waitFor(() => document.activeElement?.id === 'grade-cell-0-0', 'the focus back on the first lineman');
    press('PageUp');
    await fixture.whenStable();
    expect(text()).toContain('Snap 1 (1 of 2)');
  });

  it('locks the grid with a banner, and a coordinator unlocks it with a reason', async () => {
    await render('coordinator', desk({ locked: true }), progress({ locked: true, lockHistory: [{ action: 'locked', by: 'Dana Keel', at: '2026-09-14T08:00:00.000Z', reason: null }] }));
    expect(element().querySelector('[data-testid=locked-banner]')?.textContent).toContain('Locked by Dana Keel');
    expect(element().querySelector('tw-grade-grid table')?.getAttribute('aria-readonly')).toBe('true');

    (Array.from(element().querySelectorAll('button')).find((b) => b.textContent?.includes('Unlock grading')) as HTMLButtonElement).click();
    const reason = await waitFor(() => document.querySelector('mat-dialog-container textarea') as HTMLTextAreaElement | null, 'the unlock dialog');
    reason.value = 'Regrade of the third quarter';
    reason.dispatchEvent(new Event('input'));
    (Array.from(document.querySelectorAll('mat-dialog-container button')).find((b) => b.textContent?.trim() === 'Unlock') as HTMLButtonElement).click();
    const post = await waitFor(() => http.match('/api/film-sessions/3/grading-lock')[0], 'the unlock');
    expect(post.request.body).toEqual({ locked: false, reason: 'Regrade of the third quarter' });
    post.flush(progress({ locked: false }));
    await fixture.whenStable();
    expect(element().querySelector('[data-testid=locked-banner]')).toBeNull();
    expect(element().querySelector('tw-grade-grid table')?.getAttribute('aria-readonly')).toBe('false');
  });

  it('takes a lineman off the field for this snap', async () => {
    await render('coach');
    const remove = element().querySelector('[aria-label="Take Odell Fry off the field for this snap"]') as HTMLButtonElement;
    remove.click();
    const put = await waitFor(() => http.match('/api/snaps/21/participants')[0], 'the lineup save');
    expect(put.request.body).toEqual({
      participants: [
        { playerId: 11, position: 'LT' },
        { playerId: 12, position: 'LG' },
        { playerId: 13, position: 'C' },
        { playerId: 15, position: 'RT' },
      ],
    });
    put.flush({ participants: put.request.body.participants });
    await fixture.whenStable();
    expect(element().querySelectorAll('tw-grade-grid tbody tr[data-player]')).toHaveLength(4);
    expect(text()).toContain('Set for this snap.');
  });
});
