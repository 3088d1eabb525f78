import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { waitFor } from '../../../testing/wait-for';
import { clip, pressKey } from '../film-library/film-test-data';
import { CutPlannerPage } from './cut-planner-page';

@Component({ template: '' })
class Blank {}

const TAPE = clip({
  id: 9,
  kind: 'tape',
  originalName: 'scrimmage-endzone.mp4',
  angle: 'end_zone',
  durationMs: 20_000,
  proposedCutsMs: [9000, 4000],
  strip: { frames: 50, intervalMs: 400, tileWidth: 160, tileHeight: 90 },
});

describe('CutPlannerPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<CutPlannerPage>;
  let currentTime: number;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'film/:sessionId', component: Blank }]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(CutPlannerPage);
    fixture.componentRef.setInput('sessionId', '3');
    fixture.componentRef.setInput('clipId', '9');
    const load = await waitFor(() => (TestBed.tick(), http.match('/api/clips/9')[0]), 'the tape request');
    load.flush(TAPE);
    await fixture.whenStable();
    // jsdom plays nothing: the test sets where the video is.
    const video = (fixture.nativeElement as HTMLElement).querySelector('video') as HTMLVideoElement;
    currentTime = 0;
    Object.defineProperty(video, 'currentTime', { configurable: true, get: () => currentTime, set: (v: number) => (currentTime = v) });
    jest.spyOn(video, 'pause').mockImplementation(() => undefined);
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const markers = () => Array.from(element().querySelectorAll('[data-testid=cut-marker]'), (m) => m.getAttribute('aria-label'));

  async function press(key: string): Promise<void> {
    pressKey(key);
    await fixture.whenStable();
  }

  function confirmButton(): HTMLButtonElement {
    return Array.from(element().querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Confirm'))!;
  }

  function splitRequest(): TestRequest {
    return http.expectOne((r) => r.url === '/api/clips/9/split' && r.method === 'POST');
  }

  it('starts from the proposed cuts, in order, with a preview per snap', () => {
    expect(markers()).toEqual(['Cut 1 at 0:04.0', 'Cut 2 at 0:09.0']);
    expect(element().textContent).toContain('2 cuts → 3 snaps');
    const tiles = Array.from(element().querySelectorAll<HTMLElement>('.cards .tile'), (t) => t.style.backgroundPosition);
    // 128 px cards; 4 s = tile 10 and 9 s = tile 23 (22.5 rounds up) of the 400 ms strip.
    expect(tiles).toEqual(['0px 0px', '-1280px 0px', '-2944px 0px']);
  });

  it('adds a cut at the current time with C and confirms the sorted cuts', async () => {
    currentTime = 6.5;
    await press('c');
    currentTime = 1.2;
    await press('C');
    expect(markers()).toEqual(['Cut 1 at 0:01.2', 'Cut 2 at 0:04.0', 'Cut 3 at 0:06.5', 'Cut 4 at 0:09.0']);
    expect(element().textContent).toContain('Changed by you');

    confirmButton().click();
    const split = splitRequest();
    expect(split.request.body).toEqual({ cutsMs: [1200, 4000, 6500, 9000] });
    split.flush({ ...TAPE, status: 'processing', progress: 0 });
    await waitFor(() => TestBed.inject(Router).url === '/film/3', 'the way back to the session');
  });

  it('refuses a cut too close to another, and removes the selected one with Delete', async () => {
    currentTime = 4.2;
    await press('c');
    expect(element().querySelector('[data-testid=cut-problem]')?.textContent).toContain('Too close to the cut at 0:04.0');
    expect(markers()).toHaveLength(2);

    (element().querySelectorAll<HTMLButtonElement>('[data-testid=cut-marker]')[0]).click();
    await fixture.whenStable();
    expect(currentTime).toBe(4); // picking a cut shows its frame
    await press('Delete');
    expect(markers()).toEqual(['Cut 1 at 0:09.0']);
    confirmButton().click();
    expect(splitRequest().request.body).toEqual({ cutsMs: [9000] });
  });

  it('shows the server validation message when the split is refused', async () => {
    confirmButton().click();
    splitRequest().flush(
      { error: { code: 'validation_failed', message: 'Cuts must lie inside the tape and leave at least half a second between them.', fields: { cutsMs: 'Too close near 9000 ms.' } } },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await fixture.whenStable();
    expect(element().querySelector('[data-testid=cut-problem]')?.textContent).toContain('Too close near 9000 ms.');
    expect(TestBed.inject(Router).url).toBe('/');
  });

  it('detects again with the chosen threshold and takes the new proposal when it is ready', async () => {
    const detect = Array.from(element().querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Detect again'))!;
    detect.click();
    const request = http.expectOne('/api/clips/9/detect-cuts');
    expect(request.request.body).toEqual({ threshold: 0.3 });
    request.flush({ ...TAPE, status: 'processing', progress: 10, playbackUrl: null });
    (await waitFor(() => (TestBed.tick(), http.match('/api/clips/9')[0]), 'the next poll')).flush({ ...TAPE, proposedCutsMs: [2000, 12000, 15000] });
    await fixture.whenStable();
    expect(markers()).toEqual(['Cut 1 at 0:02.0', 'Cut 2 at 0:12.0', 'Cut 3 at 0:15.0']);
  });
});
