import { DatePipe, NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, computed, inject, input, output, signal, viewChild } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { Observable } from 'rxjs';
import type { Comment } from '@shared/api/film-room';
import { ConfirmDialog, ConfirmDialogData } from '../../core/feedback/confirm-dialog';
import { readApiError } from '../../core/http/api-error';
import { CommentsApi } from './comments-api';
import { componentLabel, kindIcon, kindLabel, momentLabel } from './point-labels';

/** Who is looking at the thread, which decides the buttons it offers. */
export interface ThreadViewer {
  userId: number | null;
  /** Set for a player: his "Got it" buttons. */
  playerId: number | null;
  /** Admins and coordinators may remove anyone's comment. */
  canModerate: boolean;
  /** Staff see who each point is for and who acknowledged it. */
  isStaff: boolean;
}

type Reply = NonNullable<Comment['replies']>[number];

/**
 * One coaching point (or question) with its replies: jump to its moment, "Got it" for the player it
 * is for, replies, and editing or removing one's own words. Calls the API itself and says `changed`
 * when the thread on the server is different, so the page can fetch it again.
 */
@Component({
  selector: 'tw-comment-thread',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, NgTemplateOutlet],
  templateUrl: './comment-thread.html',
  styleUrl: './comment-thread.scss',
})
export class CommentThread {
  readonly thread = input.required<Comment>();
  readonly viewer = input.required<ThreadViewer>();
  readonly active = input(false);
  readonly extraComponents = input<ReadonlyMap<string, string>>(new Map());
  readonly seek = output<number>();
  readonly changed = output<void>();

  private readonly api = inject(CommentsApi);
  private readonly dialog = inject(MatDialog);
  private readonly injector = inject(Injector);
  private readonly replyField = viewChild<ElementRef<HTMLTextAreaElement>>('replyField');

  protected readonly kindLabel = kindLabel;
  protected readonly kindIcon = kindIcon;
  protected readonly moment = momentLabel;

  protected readonly replying = signal(false);
  protected readonly replyText = signal('');
  protected readonly editingId = signal<number | null>(null);
  protected readonly editText = signal('');
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** "Got it" pressed and answered; shown before the thread is fetched again. */
  private readonly ackedHere = signal(false);

  protected readonly component = computed(() => {
    const key = this.thread().component;
    return key ? componentLabel(key, this.extraComponents()) : null;
  });
  protected readonly replies = computed<readonly Reply[]>(() => this.thread().replies ?? []);
  private readonly myTarget = computed(() => {
    const playerId = this.viewer().playerId;
    return playerId === null ? null : (this.thread().targets.find((t) => t.playerId === playerId) ?? null);
  });
  /** A player says "Got it" to points for him; his own questions need none. */
  protected readonly canAcknowledge = computed(() => this.myTarget() !== null && this.thread().kind !== 'question' && !this.thread().hidden);
  protected readonly acknowledged = computed(() => this.ackedHere() || (this.myTarget()?.acknowledged ?? false));
  protected readonly gotIt = computed(() => this.thread().targets.filter((t) => t.acknowledged));
  protected readonly notYet = computed(() => this.thread().targets.filter((t) => !t.acknowledged));

  protected isMine(comment: Reply): boolean {
    return comment.author.id === this.viewer().userId;
  }

  protected canRemove(comment: Reply): boolean {
    return !comment.hidden && (this.isMine(comment) || this.viewer().canModerate);
  }

  protected acknowledge(): void {
    this.run(this.api.acknowledge(this.thread().id), () => this.ackedHere.set(true));
  }

  protected sendReply(): void {
    const body = this.replyText().trim();
    if (!body) {
      this.problem.set('Write a reply first.');
      return;
    }
    this.run(this.api.reply(this.thread().id, body), () => {
      this.replyText.set('');
      this.replying.set(false);
    });
  }

  protected openReply(): void {
    this.problem.set(null);
    this.replying.set(true);
    // The box appears on the next render; put the cursor in it then.
    afterNextRender(() => this.replyField()?.nativeElement.focus(), { injector: this.injector });
  }

  protected startEdit(comment: Reply): void {
    this.problem.set(null);
    this.editingId.set(comment.id);
    this.editText.set(comment.body);
  }

  protected cancelEdit(): void {
    this.editingId.set(null);
  }

  protected saveEdit(comment: Reply): void {
    const body = this.editText().trim();
    if (!body) {
      this.problem.set('The text cannot be empty. Remove the comment instead.');
      return;
    }
    if (body === comment.body) {
      this.editingId.set(null);
      return;
    }
    this.run(this.api.edit(comment.id, body), () => this.editingId.set(null));
  }

  protected remove(comment: Reply): void {
    const isRoot = comment.id === this.thread().id;
    const data: ConfirmDialogData = {
      title: isRoot ? 'Remove this point?' : 'Remove this reply?',
      message: isRoot
        ? 'Players no longer see its words; the thread stays, marked as removed.'
        : 'Its words are replaced by "(removed)" for everyone.',
      confirmLabel: 'Remove',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .subscribe((yes) => {
        if (yes) this.run(this.api.remove(comment.id), () => undefined);
      });
  }

  private run(request: Observable<unknown>, done: () => void): void {
    this.problem.set(null);
    this.busy.set(true);
    request.subscribe({
      next: () => {
        this.busy.set(false);
        done();
        this.changed.emit();
      },
      error: (failure: unknown) => {
        this.busy.set(false);
        this.problem.set(readApiError(failure).message);
      },
    });
  }
}
