import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { GradeSaveQueue } from './grade-save-queue';

/** The desk's one-line answer to "is my work safe?". */
@Component({
  selector: 'tw-save-status',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatIconModule],
  template: `
    @let s = summary();
    <p class="status" [attr.data-state]="s.state" role="status" aria-live="polite" data-testid="save-status">
      <mat-icon aria-hidden="true">{{ s.icon }}</mat-icon>
      <span>{{ s.text }}</span>
      @if (s.state === 'offline') {
        @if (queue.retryAt(); as at) {
          <span class="when">Next try {{ at | date: 'HH:mm:ss' }}.</span>
        }
        <button mat-button type="button" (click)="queue.retryNow()">Try now</button>
      }
    </p>
    @if (!queue.storageWorks()) {
      <p class="tw-alert tw-alert-error" role="alert">
        <mat-icon aria-hidden="true">warning</mat-icon>
        This browser refuses local storage: changes not yet saved are lost if the page closes.
      </p>
    }
  `,
  styles: `
    .status {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      margin: 0;
      font: var(--mat-sys-body-medium);
      font-weight: 600;
      mat-icon {
        font-size: 20px;
        width: 20px;
        height: 20px;
      }
    }
    [data-state='saved'] {
      color: #164430;
    }
    [data-state='pending'],
    [data-state='offline'],
    [data-state='locked'] {
      color: #6b4500;
    }
    [data-state='problem'] {
      color: var(--mat-sys-error);
    }
    .when {
      font-weight: 400;
    }
  `,
})
export class SaveStatus {
  readonly sessionId = input.required<number>();
  protected readonly queue = inject(GradeSaveQueue);

  protected readonly summary = computed(() => {
    const mine = this.queue.entries().filter((e) => e.sessionId === this.sessionId());
    const others = this.queue.entries().length - mine.length;
    const count = (state: string) => mine.filter((e) => e.state === state).length;
    const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
    const conflicts = count('conflict');
    const failed = count('failed');
    const pending = count('waiting') + count('sending');
    if (this.queue.mode() === 'offline' && pending + others > 0) {
      return { state: 'offline', icon: 'cloud_off', text: `Offline: ${plural(pending + others, 'change')} kept in this browser, sent in order when the server answers.` };
    }
    if (this.queue.mode() === 'signed-out') return { state: 'problem', icon: 'login', text: `Signed out: ${plural(pending, 'change')} kept until you sign in again.` };
    if (conflicts > 0) return { state: 'problem', icon: 'call_split', text: `${plural(conflicts, 'conflict')}: choose which grade stays.` };
    if (failed > 0) return { state: 'problem', icon: 'error', text: `${plural(failed, 'change')} not saved.` };
    if (this.queue.isLocked(this.sessionId()) && pending > 0) return { state: 'locked', icon: 'lock', text: `${plural(pending, 'change')} wait: grading is locked.` };
    if (count('sending') > 0) return { state: 'pending', icon: 'sync', text: 'Saving…' };
    if (pending > 0) return { state: 'pending', icon: 'edit', text: `${plural(pending, 'unsaved change')}…` };
    return { state: 'saved', icon: 'cloud_done', text: 'All changes saved' };
  });
}
