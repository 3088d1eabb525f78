import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, computed, inject, input, linkedSignal, output, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import { ANGLE_LABELS, formatClock, type Angle } from '@shared/film';
import { PLAYBACK_SPEEDS, PlayerSource, frameStep, nextSpeed } from './player-source';
import { PLAYER_SHORTCUTS } from './player-shortcuts';
import { isButtonTarget, isPageShortcut } from './shortcut-keys';
import { ShortcutList } from './shortcut-list';
import { stripTileStyle } from './strip-tile';

const PREVIEW_WIDTH = 160;

/**
 * The film player: one snap with its angles (or one tape). Frame steps, speeds, a loop range,
 * angle switching at the same moment, hover previews from the scrub strip, and keyboard control.
 * Built to be reused by every screen that shows film.
 */
@Component({
  selector: 'tw-snap-player',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatTooltipModule, ShortcutList],
  templateUrl: './snap-player.html',
  styleUrl: './snap-player.scss',
  host: { '(document:keydown)': 'onKey($event)' },
})
export class SnapPlayer {
  /** The angles of one snap; the first is shown unless the viewer picked another angle before. */
  readonly sources = input<readonly PlayerSource[]>([]);
  /** The next snap's video, loaded in the background so moving on starts at once. */
  readonly preloadUrl = input<string | null>(null);
  readonly label = input('Snap video');
  /** Page-wide keys on or off (off when two players share a page). */
  readonly keyboard = input(true);
  readonly showShortcuts = input(true);
  /** The playing position in ms, as it plays and whenever it is moved. */
  readonly timeChange = output<number>();

  private readonly videoRef = viewChild<ElementRef<HTMLVideoElement>>('video');
  private readonly preferredAngle = signal<Angle | null>(null);
  private resumeAt: { ms: number; play: boolean } | null = null;
  private frameRequest = 0;

  protected readonly angleLabels = ANGLE_LABELS;
  protected readonly speeds = PLAYBACK_SPEEDS;
  protected readonly clock = formatClock;
  protected readonly shortcutGroups = [PLAYER_SHORTCUTS];

  protected readonly source = computed<PlayerSource | null>(() => {
    const list = this.sources();
    return list.find((s) => s.angle === this.preferredAngle()) ?? list[0] ?? null;
  });
  /** Changes when another snap is shown (not when the angle changes). */
  private readonly snapKey = computed(() => this.sources().map((s) => s.clipId).join(','));

  protected readonly timeMs = linkedSignal({ source: this.snapKey, computation: () => 0 });
  protected readonly durationMs = linkedSignal(() => this.source()?.durationMs ?? 0);
  protected readonly playing = linkedSignal({ source: this.snapKey, computation: () => false });
  protected readonly speed = signal(1);
  protected readonly loopIn = linkedSignal<string, number | null>({ source: this.snapKey, computation: () => null });
  protected readonly loopOut = linkedSignal<string, number | null>({ source: this.snapKey, computation: () => null });
  protected readonly looping = linkedSignal({ source: this.snapKey, computation: () => false });
  protected readonly announcement = signal('');
  private readonly hover = signal<{ x: number; width: number; ms: number } | null>(null);

  protected readonly loopRange = computed(() => {
    const duration = this.durationMs();
    const start = this.loopIn() ?? 0;
    const end = this.loopOut() ?? duration;
    if (duration <= 0 || (this.loopIn() === null && this.loopOut() === null)) return null;
    return { start, end, left: (start / duration) * 100, width: (Math.max(0, end - start) / duration) * 100 };
  });

  protected readonly preview = computed(() => {
    const hover = this.hover();
    const source = this.source();
    if (!hover) return null;
    const left = Math.min(Math.max(0, hover.x - PREVIEW_WIDTH / 2), Math.max(0, hover.width - PREVIEW_WIDTH));
    const tile = source?.strip && source.stripUrl ? stripTileStyle(source.stripUrl, source.strip, hover.ms, PREVIEW_WIDTH) : null;
    return { time: formatClock(hover.ms), tile, left: `${left}px` };
  });

  constructor() {
    inject(DestroyRef).onDestroy(() => cancelAnimationFrame(this.frameRequest));
  }

  /** Where the video is now, read from the element (exact even between time updates). */
  currentMs(): number {
    const video = this.videoRef()?.nativeElement;
    return video ? Math.round(video.currentTime * 1000) : this.timeMs();
  }

  seekTo(ms: number): void {
    const video = this.videoRef()?.nativeElement;
    if (!video) return;
    const duration = this.durationMs();
    video.currentTime = Math.max(0, duration > 0 ? Math.min(ms, duration) : ms) / 1000;
    this.sync();
  }

  pause(): void {
    this.videoRef()?.nativeElement.pause();
  }

  protected togglePlay(): void {
    const video = this.videoRef()?.nativeElement;
    if (!video) return;
    if (video.paused || video.ended) {
      const start = this.loopStartIfOutside(video.currentTime * 1000);
      if (start !== null) video.currentTime = start / 1000;
      // Browsers may refuse to play (tab in background); the button simply stays on "Play".
      void video.play()?.catch(() => undefined);
    } else {
      video.pause();
    }
  }

  /** Frame step: pauses, then moves by exactly 1/fps of the clip per frame. */
  protected step(frames: number): void {
    const video = this.videoRef()?.nativeElement;
    if (!video) return;
    video.pause();
    video.currentTime = frameStep(video.currentTime, this.source()?.fps ?? null, frames, video.duration);
    this.sync();
  }

  protected jump(seconds: number): void {
    const video = this.videoRef()?.nativeElement;
    if (!video) return;
    const end = Number.isFinite(video.duration) ? video.duration : Number.POSITIVE_INFINITY;
    video.currentTime = Math.min(end, Math.max(0, video.currentTime + seconds));
    this.sync();
  }

  protected setSpeed(speed: number): void {
    this.speed.set(speed);
    const video = this.videoRef()?.nativeElement;
    if (video) {
      video.defaultPlaybackRate = speed;
      video.playbackRate = speed;
    }
    this.announcement.set(`Speed ${speed}×`);
  }

  protected chooseAngle(angle: Angle): void {
    const current = this.source();
    if (!current || current.angle === angle) return;
    const video = this.videoRef()?.nativeElement;
    // The new angle loads from its start; go back to the same moment once it can seek.
    this.resumeAt = { ms: this.currentMs(), play: video ? !video.paused : false };
    this.preferredAngle.set(angle);
    this.announcement.set(`${ANGLE_LABELS[angle]} angle`);
  }

  protected nextAngle(): void {
    const list = this.sources();
    const current = this.source();
    if (list.length < 2 || !current) return;
    const index = list.findIndex((s) => s.clipId === current.clipId);
    this.chooseAngle(list[(index + 1) % list.length].angle);
  }

  protected markIn(): void {
    const now = this.currentMs();
    const out = this.loopOut();
    this.loopIn.set(now);
    if (out !== null && out <= now) this.loopOut.set(null);
    this.announcement.set(`Loop starts at ${formatClock(now)}`);
  }

  protected markOut(): void {
    const now = this.currentMs();
    const start = this.loopIn();
    this.loopOut.set(now);
    if (start !== null && start >= now) this.loopIn.set(null);
    this.announcement.set(`Loop ends at ${formatClock(now)}`);
  }

  protected toggleLoop(): void {
    this.looping.update((on) => !on);
    this.announcement.set(this.looping() ? 'Loop on' : 'Loop off');
    if (this.looping()) {
      const start = this.loopStartIfOutside(this.currentMs());
      if (start !== null) this.seekTo(start);
    }
  }

  protected onMetadata(): void {
    const video = this.videoRef()?.nativeElement;
    if (!video) return;
    if (Number.isFinite(video.duration) && video.duration > 0) this.durationMs.set(Math.round(video.duration * 1000));
    video.defaultPlaybackRate = this.speed();
    video.playbackRate = this.speed();
    const resume = this.resumeAt;
    this.resumeAt = null;
    if (resume) {
      video.currentTime = Math.min(resume.ms, this.durationMs()) / 1000;
      if (resume.play) void video.play()?.catch(() => undefined);
    }
    this.sync();
  }

  protected onPlay(): void {
    this.playing.set(true);
    cancelAnimationFrame(this.frameRequest);
    // Time updates arrive only about 4 times a second; follow the frames while playing.
    const tick = () => {
      this.sync();
      this.frameRequest = requestAnimationFrame(tick);
    };
    this.frameRequest = requestAnimationFrame(tick);
  }

  protected onPause(): void {
    this.playing.set(false);
    cancelAnimationFrame(this.frameRequest);
    this.sync();
  }

  protected onEnded(): void {
    if (this.looping()) {
      this.seekTo(this.loopIn() ?? 0);
      void this.videoRef()?.nativeElement.play()?.catch(() => undefined);
      return;
    }
    this.onPause();
  }

  protected onTime(): void {
    this.sync();
  }

  protected onScrub(event: Event): void {
    this.seekTo(Number((event.target as HTMLInputElement).value));
  }

  protected onHover(event: PointerEvent): void {
    const track = event.currentTarget as HTMLElement;
    const box = track.getBoundingClientRect();
    const duration = this.durationMs();
    if (box.width <= 0 || duration <= 0) return;
    const x = Math.min(box.width, Math.max(0, event.clientX - box.left));
    this.hover.set({ x, width: box.width, ms: (x / box.width) * duration });
  }

  protected endHover(): void {
    this.hover.set(null);
  }

  protected onKey(event: KeyboardEvent): void {
    if (!this.keyboard() || !this.source() || !isPageShortcut(event)) return;
    switch (event.key) {
      case ' ':
        if (isButtonTarget(event.target)) return;
        this.togglePlay();
        break;
      case 'ArrowLeft':
        if (event.shiftKey) this.jump(-1);
        else this.step(-1);
        break;
      case 'ArrowRight':
        if (event.shiftKey) this.jump(1);
        else this.step(1);
        break;
      case '[':
        this.setSpeed(nextSpeed(this.speed(), -1));
        break;
      case ']':
        this.setSpeed(nextSpeed(this.speed(), 1));
        break;
      case 'a':
      case 'A':
        this.nextAngle();
        break;
      case 'i':
      case 'I':
        this.markIn();
        break;
      case 'o':
      case 'O':
        this.markOut();
        break;
      case 'l':
      case 'L':
        this.toggleLoop();
        break;
      default:
        return;
    }
    event.preventDefault();
  }

  /** Reads the element's time into the signals, wrapping around at the loop end. */
  private sync(): void {
    const video = this.videoRef()?.nativeElement;
    if (!video) return;
    let ms = video.currentTime * 1000;
    const range = this.loopRange();
    if (this.looping() && range && !video.paused && ms >= range.end) {
      video.currentTime = range.start / 1000;
      ms = range.start;
    }
    this.timeMs.set(ms);
    this.timeChange.emit(ms);
  }

  private loopStartIfOutside(ms: number): number | null {
    const range = this.loopRange();
    if (!this.looping() || !range) return null;
    return ms < range.start || ms >= range.end ? range.start : null;
  }
}
