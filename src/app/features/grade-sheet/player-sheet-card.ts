import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { GradeSheetPlayer } from '@shared/api/grading';
import { byCount, componentRows, formatRate, winningLine } from './sheet-format';

/** One lineman's numbers for the session. */
@Component({
  selector: 'tw-player-sheet-card',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './player-sheet-card.html',
  styleUrl: './player-sheet-card.scss',
  host: { class: 'sheet-card' },
})
export class PlayerSheetCard {
  readonly player = input.required<GradeSheetPlayer>();
  readonly threshold = input.required<number>();
  readonly extraLabels = input<ReadonlyMap<string, string>>(new Map());
  readonly canMail = input(false);
  readonly mailing = input(false);
  readonly mail = output<void>();

  protected readonly rate = formatRate;
  protected readonly winning = computed(() => winningLine(this.player(), this.threshold()));
  protected readonly components = computed(() => componentRows(this.player().components, this.extraLabels()));
  protected readonly missed = computed(() => byCount(this.player().missedByReason));
  protected readonly penalties = computed(() => byCount(this.player().penaltiesByType));
  protected readonly notes = computed(() => [...this.player().notes].sort((a, b) => a.snapOrder - b.snapOrder));
}
