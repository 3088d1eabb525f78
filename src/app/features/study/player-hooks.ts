import { DestroyRef, Directive, ElementRef, inject, output } from '@angular/core';

const MEDIA_EVENTS = ['loadedmetadata', 'play', 'pause', 'ended'] as const;

/**
 * What the study screens need from the snap player that it does not offer as outputs: its video's
 * play / pause / ended / ready events, and starting playback. Media events do not bubble, so they
 * are caught on the way down (capture). The preloading video of the next clip is ignored.
 */
@Directive({ selector: 'tw-snap-player[twPlayerHooks]', exportAs: 'playerHooks' })
export class PlayerHooks {
  readonly videoReady = output<void>();
  readonly videoPlay = output<void>();
  readonly videoPause = output<void>();
  readonly videoEnded = output<void>();

  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;

  constructor() {
    const listener = (event: Event) => {
      const video = event.target;
      if (!(video instanceof HTMLVideoElement) || video.classList.contains('preload')) return;
      switch (event.type) {
        case 'loadedmetadata':
          this.videoReady.emit();
          break;
        case 'play':
          this.videoPlay.emit();
          break;
        case 'pause':
          this.videoPause.emit();
          break;
        case 'ended':
          this.videoEnded.emit();
          break;
      }
    };
    for (const type of MEDIA_EVENTS) this.host.addEventListener(type, listener, true);
    inject(DestroyRef).onDestroy(() => {
      for (const type of MEDIA_EVENTS) this.host.removeEventListener(type, listener, true);
    });
  }

  /** Starts the shown video; browsers may refuse without a user gesture, and then it simply waits. */
  play(): void {
    const video = this.host.querySelector<HTMLVideoElement>('video:not(.preload)');
    void video?.play()?.catch(() => undefined);
  }
}
