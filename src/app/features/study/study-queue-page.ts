import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { groupBySession, plural, studyState } from './clip-groups';
import { MY_CLIPS_URL, MY_CUTUPS_URL, MyClips, SharedCutup } from './study-api';
import { StudyClipCard } from './study-clip-card';

/**
 * The Study Queue: a player's clips with his coaching points (and, when his staff shares grades, his
 * grade on each snap and a link to his Grade Sheet), newest first, by session; then his cut-ups.
 */
@Component({
  selector: 'tw-study-queue-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatIconModule, RouterLink, StatePanel, StudyClipCard],
  templateUrl: './study-queue-page.html',
  styleUrl: './study-queue-page.scss',
})
export class StudyQueuePage {
  protected readonly queue = httpResource<MyClips>(() => ({ url: MY_CLIPS_URL, context: inlineErrors() }));
  protected readonly cutupList = httpResource<{ cutups: SharedCutup[] }>(() => ({ url: MY_CUTUPS_URL, context: inlineErrors() }));

  protected readonly clips = computed(() => (this.queue.hasValue() ? this.queue.value().clips : []));
  protected readonly gradesShared = computed(() => this.queue.hasValue() && this.queue.value().gradesShared);
  protected readonly groups = computed(() => groupBySession(this.clips()));
  protected readonly cutups = computed(() => (this.cutupList.hasValue() ? this.cutupList.value().cutups : []));

  protected readonly summary = computed(() => {
    const states = this.clips().map(studyState);
    const newPoints = states.reduce((sum, s) => sum + s.newPoints, 0);
    const toWatch = states.filter((s) => !s.watched).length;
    if (states.length === 0) return '';
    const parts = [newPoints === 0 ? 'No new points' : `${plural(newPoints, 'new point')} to read`, toWatch === 0 ? 'every clip watched' : `${plural(toWatch, 'clip')} to watch`];
    return parts.join(', ') + '.';
  });
}
