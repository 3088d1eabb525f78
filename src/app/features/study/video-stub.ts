/**
 * For specs: jsdom has no media engine, so give a video element a settable clock, a paused flag and
 * play/pause that keep it. Specs spy on play/pause themselves when they need to (jest.spyOn calls through).
 */
export function stubVideo(video: HTMLVideoElement, durationSeconds = 8): void {
  let currentTime = 0;
  let paused = true;
  Object.defineProperty(video, 'currentTime', { configurable: true, get: () => currentTime, set: (v: number) => (currentTime = v) });
  Object.defineProperty(video, 'paused', { configurable: true, get: () => paused });
  Object.defineProperty(video, 'duration', { configurable: true, get: () => durationSeconds });
  video.pause = () => {
    paused = true;
  };
  video.play = () => {
    paused = false;
    return Promise.resolve();
  };
}
