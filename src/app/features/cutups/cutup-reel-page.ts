import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, linkedSignal, numberAttribute, untracked, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Title } from '@angular/platform-browser';
import { RouterLink } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { SafetyNote } from '../../core/feedback/safety-note';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { SnapPlayer } from '../snap-player/snap-player';
import { clipSource } from '../study/clip-source';
import { PlayerHooks } from '../study/player-hooks';
import { StudyApi } from '../study/study-api';
import { ViewReporter } from '../study/view-reporter';
import { Cutup, CutupItem, CutupsApi } from './cutups-api';
import { clipLabel } from './reel-item';

/**
 * A cut-up played straight through: when a clip ends the next one starts, with the coach's note for
 * each clip beside the video. Players' viewing counts toward their watched clips.
 */
@Component({
  selector: 'tw-cutup-reel-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, PlayerHooks, RouterLink, SafetyNote, SnapPlayer, StatePanel],
  templateUrl: './cutup-reel-page.html',
  styleUrl: './cutup-reel-page.scss',
})
export class CutupReelPage {
  readonly cutupId = input.required({ transform: numberAttribute });

  private readonly auth = inject(AuthStore);
  private readonly api = inject(CutupsApi);
  private readonly studyApi = inject(StudyApi);
  private readonly player = viewChild(SnapPlayer);
  private readonly hooks = viewChild(PlayerHooks);

  protected readonly label = clipLabel;
  protected readonly isPlayer = computed(() => this.auth.role() === 'player');
  protected readonly backLink = computed(() => (this.isPlayer() ? '/study' : '/cutups'));

  protected readonly cutup = httpResource<Cutup>(() => ({ url: this.api.cutupUrl(this.cutupId()), context: inlineErrors() }));
  /** Clips still processing (or failed) have nothing to play and are skipped. */
  protected readonly playable = computed(() => (this.cutup.hasValue() ? this.cutup.value().items.filter((i) => i.playbackUrl !== null) : []));
  protected readonly index = linkedSignal({ source: this.playable, computation: () => 0 });
  protected readonly current = computed<CutupItem | null>(() => this.playable()[this.index()] ?? null);
  protected readonly sources = computed(() => {
    const item = this.current();
    return item ? clipSource(item) : [];
  });
  protected readonly preloadUrl = computed(() => this.playable()[this.index() + 1]?.playbackUrl ?? null);
  protected readonly skipped = computed(() => (this.cutup.hasValue() ? this.cutup.value().items.length - this.playable().length : 0));

  /** Set when a clip ended (or was picked) so the next one starts by itself. */
  private playWhenReady = false;
  private reporter: ViewReporter | null = null;
  private lastMs = 0;

  constructor() {
    const title = inject(Title);
    effect(() => {
      if (this.cutup.hasValue()) title.setTitle(`${this.cutup.value().title} · Cut-up · Trenchwork`);
    });
    effect(() => {
      const item = this.current();
      untracked(() => {
        this.reporter?.stop();
        this.reporter = item && this.isPlayer() ? new ViewReporter((fromMs, toMs) => this.studyApi.recordView(item.clipId, fromMs, toMs)) : null;
      });
    });
    inject(DestroyRef).onDestroy(() => this.reporter?.stop());
  }

  protected go(index: number, play: boolean): void {
    if (index < 0 || index >= this.playable().length) return;
    if (index === this.index()) {
      this.player()?.seekTo(0);
      if (play) this.hooks()?.play();
      return;
    }
    this.playWhenReady = play;
    this.index.set(index);
  }

  protected onReady(): void {
    if (!this.playWhenReady) return;
    this.playWhenReady = false;
    this.hooks()?.play();
  }

  protected onEnded(): void {
    this.reporter?.paused(this.lastMs);
    this.go(this.index() + 1, true);
  }

  protected onTime(ms: number): void {
    this.lastMs = ms;
    this.reporter?.time(ms);
  }

  protected onPlay(): void {
    this.reporter?.playing(this.player()?.currentMs() ?? this.lastMs);
  }

  protected onPause(): void {
    this.reporter?.paused(this.player()?.currentMs() ?? this.lastMs);
  }
}
