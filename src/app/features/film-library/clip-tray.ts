import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import type { Clip, Snap } from '@shared/api/film';
import { ANGLE_LABELS, formatClock } from '@shared/film';
import { ConfirmDialog, ConfirmDialogData } from '../../core/feedback/confirm-dialog';
import { Notifier } from '../../core/feedback/notifier';
import { ClipStateBadge } from './clip-state-badge';
import { FilmApi } from './film-api';

/** The clips that need a hand: failed ones (retry, remove), tapes to cut, clips not on a snap yet. */
@Component({
  selector: 'tw-clip-tray',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ClipStateBadge, MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule, RouterLink],
  templateUrl: './clip-tray.html',
  styleUrl: './clip-tray.scss',
})
export class ClipTray {
  readonly sessionId = input.required<number>();
  readonly clips = input.required<readonly Clip[]>();
  readonly snaps = input<readonly Snap[]>([]);
  /** Something changed on the server: fetch clips and snaps again. */
  readonly changed = output<void>();

  private readonly api = inject(FilmApi);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);

  protected readonly angleLabels = ANGLE_LABELS;
  protected readonly clock = formatClock;

  private readonly snapOrder = computed(() => new Map(this.snaps().map((s) => [s.id, s.order])));
  protected readonly failed = computed(() => this.clips().filter((c) => c.status === 'failed'));
  protected readonly tapes = computed(() => this.clips().filter((c) => c.kind === 'tape' && c.status !== 'failed'));
  protected readonly unplaced = computed(() => this.clips().filter((c) => c.kind === 'snap' && c.snapId === null && c.status !== 'failed'));

  protected where(clip: Clip): string {
    const order = clip.snapId === null ? undefined : this.snapOrder().get(clip.snapId);
    const place = clip.kind === 'tape' ? 'tape' : order === undefined ? 'not on a snap' : `snap ${order}`;
    return `${this.angleLabels[clip.angle]} · ${place}`;
  }

  protected retry(clip: Clip): void {
    this.api.retryClip(clip.id).subscribe(() => {
      this.notifier.info(`${clip.originalName} is being processed again.`);
      this.changed.emit();
    });
  }

  protected remove(clip: Clip): void {
    const data: ConfirmDialogData = {
      title: 'Remove this clip?',
      message: `${clip.originalName} and its stored video are deleted. The snap stays, with its tags.`,
      confirmLabel: 'Remove clip',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .subscribe((confirmed) => {
        if (!confirmed) return;
        this.api.removeClip(clip.id).subscribe(() => {
          this.notifier.info(`Removed ${clip.originalName}.`);
          this.changed.emit();
        });
      });
  }

  protected place(clip: Clip, snapId: number): void {
    this.api.placeClip(clip.id, snapId).subscribe(() => {
      this.notifier.info(`${clip.originalName} is now on snap ${this.snapOrder().get(snapId) ?? ''}.`);
      this.changed.emit();
    });
  }
}
