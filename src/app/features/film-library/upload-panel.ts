import { ChangeDetectionStrategy, Component, ElementRef, inject, input, output, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { Clip } from '@shared/api/film';
import { ANGLES, ANGLE_LABELS, type Angle, type ClipKind } from '@shared/film';
import { ClipStateBadge } from './clip-state-badge';
import { UploadItem, UploadQueue, isRunning } from './upload-queue';

const STATUS_TEXT: Record<UploadItem['status'], string> = {
  waiting: 'Waiting to send',
  sending: 'Sending',
  storing: 'Sent; the server is storing it',
  received: 'Received',
  skipped: 'Skipped',
  refused: 'Refused',
  failed: 'Not sent',
  cancelled: 'Cancelled',
};

const STATUS_ICONS: Record<UploadItem['status'], string> = {
  waiting: 'hourglass_empty',
  sending: 'upload',
  storing: 'cloud_upload',
  received: 'check_circle',
  skipped: 'content_copy',
  refused: 'block',
  failed: 'error_outline',
  cancelled: 'cancel',
};

export function formatBytes(bytes: number): string {
  if (bytes < 1024 * 1024) return `${Math.max(1, Math.round(bytes / 1024))} kB`;
  if (bytes < 1024 ** 3) return `${(bytes / 1024 ** 2).toFixed(1)} MB`;
  return `${(bytes / 1024 ** 3).toFixed(2)} GB`;
}

/** Add film to a session: drop or pick many files; each is sent on its own with its own progress. */
@Component({
  selector: 'tw-upload-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ClipStateBadge, MatButtonModule, MatButtonToggleModule, MatIconModule, MatProgressBarModule],
  providers: [UploadQueue],
  templateUrl: './upload-panel.html',
  styleUrl: './upload-panel.scss',
  host: { '(window:beforeunload)': 'warnBeforeUnload($event)' },
})
export class UploadPanel {
  readonly sessionId = input.required<number>();
  /** The session's clips, where a refused file's reason is found. */
  readonly clips = input<readonly Clip[]>([]);
  /** A file got an answer: new clips may be waiting on the server. */
  readonly uploaded = output<void>();

  protected readonly queue = inject(UploadQueue);
  private readonly picker = viewChild.required<ElementRef<HTMLInputElement>>('picker');

  protected readonly angles = ANGLES;
  protected readonly angleLabels = ANGLE_LABELS;
  protected readonly statusText = STATUS_TEXT;
  protected readonly statusIcons = STATUS_ICONS;
  protected readonly formatBytes = formatBytes;
  protected readonly isRunning = isRunning;
  protected readonly angle = signal<Angle>('sideline');
  protected readonly kind = signal<ClipKind>('snap');
  protected readonly dragging = signal(false);

  constructor() {
    this.queue.finished.pipe(takeUntilDestroyed()).subscribe(() => this.uploaded.emit());
  }

  /** For the page's leave guard. */
  uploadsRunning(): boolean {
    return this.queue.active();
  }

  protected choose(): void {
    this.picker().nativeElement.click();
  }

  protected picked(): void {
    const input = this.picker().nativeElement;
    const files = Array.from(input.files ?? []);
    input.value = ''; // Picking the same files again must fire `change` again.
    this.add(files);
  }

  protected onDragOver(event: DragEvent): void {
    event.preventDefault();
    if (event.dataTransfer) event.dataTransfer.dropEffect = 'copy';
    this.dragging.set(true);
  }

  protected onDrop(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    this.add(Array.from(event.dataTransfer?.files ?? []));
  }

  protected reasonOf(item: UploadItem): string | null {
    if (item.status !== 'refused') return item.message;
    const clip = this.clips().find((c) => c.id === item.clipId);
    return clip?.failureReason ? `Refused: ${clip.failureReason}` : 'Refused: the server could not read it as video.';
  }

  /** A received file's clip as the page last polled it: processing, ready or failed. */
  protected clipOf(item: UploadItem): Clip | null {
    return item.status === 'received' ? (this.clips().find((c) => c.id === item.clipId) ?? null) : null;
  }

  protected percentOf(item: UploadItem): number {
    return item.file.size === 0 ? 100 : Math.min(100, Math.round((item.sent / item.file.size) * 100));
  }

  protected warnBeforeUnload(event: BeforeUnloadEvent): void {
    if (!this.queue.active()) return;
    // Browsers show their own wording; both calls are needed across browsers.
    event.preventDefault();
    event.returnValue = '';
  }

  private add(files: File[]): void {
    if (files.length > 0) this.queue.add(this.sessionId(), files, this.angle(), this.kind());
  }
}
