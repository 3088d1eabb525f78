import { OverlayContainer } from '@angular/cdk/overlay';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { Player } from '@shared/api/roster';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { TAG_ITEMS, filmSession } from '../film-library/film-test-data';
import { CutupBuilderPage } from './cutup-builder-page';
import type { Cutup, PreviewClip } from './cutups-api';

function player(id: number, name: string, jersey: number): Player {
  return { id, name, jersey, positions: ['LT'], classYear: 'Jr', redshirt: false, heightIn: null, weightLb: null, status: 'active', seasonId: 5, accountEmail: null };
}

const FOUND: PreviewClip[] = [
  { clipId: 40, sessionId: 3, sessionTitle: 'Week 2 vs Quarry Bend', sessionDate: '2026-09-11', snapOrder: 4, angle: 'sideline', posterUrl: '/api/clips/40/poster' },
  { clipId: 41, sessionId: 3, sessionTitle: 'Week 2 vs Quarry Bend', sessionDate: '2026-09-11', snapOrder: 9, angle: 'sideline', posterUrl: '/api/clips/41/poster' },
];

describe('CutupBuilderPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<CutupBuilderPage>;

  beforeEach(async () => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'cutups/:cutupId', children: [] }]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).setSession(sessionFor('coach'));
    fixture = TestBed.createComponent(CutupBuilderPage);
    const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match((r) => r.url === url)[0]), url)).flush(body);
    await answer('/api/film-sessions', { sessions: [filmSession()], seasonId: 5 });
    await answer('/api/teams/1/tag-lists', { items: TAG_ITEMS });
    await answer('/api/teams/1/players', { players: [player(70, 'Bram Oakes', 70), player(74, 'Dana Keel', 74)], seasonId: 5 });
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const overlay = () => TestBed.inject(OverlayContainer).getContainerElement();
  const button = (label: string) => Array.from(element().querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.replace(/\s+/g, ' ').trim().includes(label))!;

  async function choose(testId: string, option: string): Promise<void> {
    element().querySelector<HTMLElement>(`[data-testid=${testId}] .mat-mdc-select-trigger`)!.click();
    await fixture.whenStable();
    Array.from(overlay().querySelectorAll<HTMLElement>('mat-option')).find((o) => o.textContent?.trim() === option)!.click();
    await fixture.whenStable();
  }

  /** The debounce may let an earlier filter through first; the last request is the live one. */
  function lastPreview(): Promise<TestRequest> {
    return waitFor(() => {
      const open = http.match('/api/cutups/preview');
      for (const early of open.slice(0, -1)) early.flush({ clips: [] });
      return open.at(-1);
    }, 'the preview');
  }

  it('shows the safety caution over the clips and their notes', () => {
    expect(element().querySelector('#reel-title + tw-safety-note [role=note]')?.textContent).toContain('Safety:');
  });

  it('asks for nothing until the filter narrows, then previews with exactly the filter chosen', async () => {
    await new Promise((resolve) => setTimeout(resolve, 350));
    expect(http.match('/api/cutups/preview')).toHaveLength(0);
    expect(element().textContent).toContain('Choose a session, a concept, a front or a player');

    Array.from(element().querySelectorAll<HTMLElement>('mat-chip-option')).find((c) => c.textContent?.includes('power'))!.querySelector('button')!.click();
    await choose('filter-player', '#70 Bram Oakes');
    await choose('filter-component', 'Pad level');
    Array.from(element().querySelectorAll<HTMLButtonElement>('[data-testid=filter-angle] button')).find((b) => b.textContent?.includes('Sideline'))!.click();
    await fixture.whenStable();

    const preview = await lastPreview();
    expect(preview.request.method).toBe('POST');
    expect(preview.request.body).toEqual({ teamId: 1, filter: { conceptIds: [102], playerId: 70, component: 'padLevel', mark: 'minus', angle: 'sideline' } });
    preview.flush({ clips: FOUND });
    await fixture.whenStable();
    expect(element().querySelectorAll('[data-testid=preview-clip]')).toHaveLength(2);
    expect(element().textContent).toContain('2 clips match.');
  });

  it('builds a cut-up from the preview with a note, shares it with the line, and saves it in three steps', async () => {
    await choose('filter-sessions', 'Week 2 vs Quarry Bend');
    const preview = await lastPreview();
    expect(preview.request.body).toEqual({ teamId: 1, filter: { sessionIds: [3] } });
    preview.flush({ clips: FOUND });
    await fixture.whenStable();

    button('Add all 2').click();
    await fixture.whenStable();
    expect(element().querySelectorAll('[data-testid=reel-item]')).toHaveLength(2);
    // The second clip first, by the keyboard-friendly move button.
    element().querySelector<HTMLButtonElement>('[aria-label="Move clip 2 up"]')!.click();
    await fixture.whenStable();
    const note = element().querySelector<HTMLInputElement>('[data-testid=reel-item] input')!;
    note.value = 'Watch his hat placement';
    note.dispatchEvent(new Event('input'));

    const title = element().querySelector<HTMLInputElement>('[data-testid=cutup-title]')!;
    title.value = 'Pad level, week 2';
    title.dispatchEvent(new Event('input'));
    Array.from(element().querySelectorAll<HTMLElement>('tw-cutup-share-panel mat-checkbox')).find((c) => c.textContent?.includes('Offensive line'))!.querySelector('input')!.click();
    await fixture.whenStable();

    button('Save').click();
    const created = await waitFor(() => http.match((r) => r.method === 'POST' && r.url === '/api/cutups')[0], 'the create');
    expect(created.request.body).toEqual({ teamId: 1, title: 'Pad level, week 2', clipIds: [41, 40] });
    const stored: Cutup = { id: 77, teamId: 1, title: 'Pad level, week 2', description: null, filter: null, items: [], sharedWith: { playerIds: [], groups: [] } };
    created.flush(stored);

    const patched = await waitFor(() => http.match((r) => r.method === 'PATCH' && r.url === '/api/cutups/77')[0], 'the notes');
    expect(patched.request.body).toEqual({ items: [{ clipId: 41, note: 'Watch his hat placement' }, { clipId: 40, note: null }] });
    patched.flush(stored);

    const shared = await waitFor(() => http.match((r) => r.method === 'PUT' && r.url === '/api/cutups/77/shares')[0], 'the share');
    expect(shared.request.body).toEqual({ playerIds: [], groups: ['OL'] });
    shared.flush(stored);
    await waitFor(() => TestBed.inject(Router).url === '/cutups/77', 'the move to the saved cut-up');
  });
});
