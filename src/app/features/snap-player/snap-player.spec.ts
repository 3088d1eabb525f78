import { ComponentFixture, TestBed } from '@angular/core/testing';
import { PlayerSource } from './player-source';
import { SnapPlayer } from './snap-player';

function source(overrides: Partial<PlayerSource>): PlayerSource {
  return {
    clipId: 1,
    angle: 'sideline',
    playbackUrl: '/api/clips/1/playback',
    posterUrl: '/api/clips/1/poster',
    fps: 25,
    durationMs: 8000,
    stripUrl: '/api/clips/1/strip',
    strip: { frames: 20, intervalMs: 400, tileWidth: 160, tileHeight: 90 },
    ...overrides,
  };
}

/** jsdom has no media engine: give the element a settable clock and a paused flag. */
function stubVideo(video: HTMLVideoElement): { time: () => number } {
  let currentTime = 0;
  let paused = true;
  Object.defineProperty(video, 'currentTime', { configurable: true, get: () => currentTime, set: (v: number) => (currentTime = v) });
  Object.defineProperty(video, 'paused', { configurable: true, get: () => paused });
  jest.spyOn(video, 'pause').mockImplementation(() => {
    paused = true;
  });
  jest.spyOn(video, 'play').mockImplementation(() => {
    paused = false;
    return Promise.resolve();
  });
  return { time: () => currentTime };
}

describe('SnapPlayer', () => {
  let fixture: ComponentFixture<SnapPlayer>;

  beforeEach(async () => {
    fixture = TestBed.createComponent(SnapPlayer);
    fixture.componentRef.setInput('sources', [
      source({}),
      source({ clipId: 2, angle: 'end_zone', playbackUrl: '/api/clips/2/playback', fps: 30 }),
    ]);
    await fixture.whenStable();
  });

  const element = () => fixture.nativeElement as HTMLElement;
  const video = () => element().querySelector('video:not(.preload)') as HTMLVideoElement;

  async function press(key: string, shiftKey = false): Promise<KeyboardEvent> {
    const event = new KeyboardEvent('keydown', { key, shiftKey, bubbles: true, cancelable: true });
    document.body.dispatchEvent(event);
    await fixture.whenStable();
    return event;
  }

  it('steps one frame at the clip frame rate with the arrow keys and the buttons', async () => {
    const clock = stubVideo(video());
    video().currentTime = 2;
    expect((await press('ArrowRight')).defaultPrevented).toBe(true);
    expect(clock.time()).toBeCloseTo(2 + 1 / 25, 9);
    await press('ArrowLeft');
    await press('ArrowLeft');
    expect(clock.time()).toBeCloseTo(2 - 1 / 25, 9);
    expect(video().pause).toHaveBeenCalled();

    (element().querySelector('[aria-label="One frame forward"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    expect(clock.time()).toBeCloseTo(2, 9);
    expect(element().querySelector('.time')?.textContent).toContain('0:02.0');
  });

  it('jumps a second with Shift and never before the start', async () => {
    const clock = stubVideo(video());
    video().currentTime = 0.5;
    await press('ArrowRight', true);
    expect(clock.time()).toBeCloseTo(1.5, 9);
    await press('ArrowLeft', true);
    await press('ArrowLeft', true);
    expect(clock.time()).toBe(0);
  });

  it('changes speed with [ and ] through ¼×, ½×, 1× and 2×', async () => {
    stubVideo(video());
    await press(']');
    expect(video().playbackRate).toBe(2);
    await press(']');
    expect(video().playbackRate).toBe(2);
    await press('[');
    await press('[');
    await press('[');
    expect(video().playbackRate).toBe(0.25);
    expect(element().querySelector('.speed-tag')?.textContent).toContain('0.25×');
  });

  it('switches angle with A and returns to the same moment when the new angle loads', async () => {
    const clock = stubVideo(video());
    video().currentTime = 3.2;
    await press('a');
    expect(video().getAttribute('src')).toBe('/api/clips/2/playback');
    video().currentTime = 0; // a new source starts at zero

    video().dispatchEvent(new Event('loadedmetadata'));
    await fixture.whenStable();
    expect(clock.time()).toBeCloseTo(3.2, 9);
    // Frame steps now follow the end zone clip's 30 fps.
    await press('ArrowRight');
    expect(clock.time()).toBeCloseTo(3.2 + 1 / 30, 9);
  });

  it('marks a loop with I and O and wraps around at its end while playing', async () => {
    const clock = stubVideo(video());
    video().currentTime = 1;
    await press('i');
    video().currentTime = 2.5;
    await press('o');
    await press('l');
    expect(element().textContent).toContain('In 0:01.0');
    expect(element().textContent).toContain('Out 0:02.5');
    await press(' ');
    expect(video().play).toHaveBeenCalled();
    video().currentTime = 2.6;
    video().dispatchEvent(new Event('timeupdate'));
    expect(clock.time()).toBeCloseTo(1, 9);
  });

  it('shows the strip tile of the hovered moment above the seek bar', async () => {
    const scrub = element().querySelector('.scrub') as HTMLElement;
    jest.spyOn(scrub, 'getBoundingClientRect').mockReturnValue({ left: 0, top: 0, width: 800, height: 20, right: 800, bottom: 20, x: 0, y: 0, toJSON: () => ({}) });
    // jsdom lacks PointerEvent; the handler reads clientX only.
    const move = new MouseEvent('pointermove', { clientX: 400, bubbles: true });
    scrub.dispatchEvent(move);
    await fixture.whenStable();
    const tile = element().querySelector('.preview .tile') as HTMLElement;
    // 400 px of 800 = 4.0 s = tile 10 of the 400 ms strip; tiles are 160 px wide.
    expect(tile.style.backgroundPosition).toBe('-1600px 0px');
    expect(element().querySelector('.preview')?.textContent).toContain('0:04.0');
  });

  it('preloads the next snap video and names its controls', async () => {
    fixture.componentRef.setInput('preloadUrl', '/api/clips/9/playback');
    await fixture.whenStable();
    const preload = element().querySelector('video.preload') as HTMLVideoElement;
    expect(preload.getAttribute('src')).toBe('/api/clips/9/playback');
    expect(preload.getAttribute('preload')).toBe('auto');
    expect(video().getAttribute('aria-label')).toBe('Snap video, Sideline angle');
    expect(element().querySelector('input[type=range]')?.getAttribute('aria-label')).toBe('Position in the video');
  });
});
