import { DatePipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { GradingProgress } from '@shared/api/grading';

/** Cells graded of cells expected, per coach, and the lock for those who hold it. */
@Component({
  selector: 'tw-grading-progress-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatIconModule, PercentPipe],
  template: `
    @let p = progress();
    <section class="progress" aria-labelledby="progress-title">
      <div class="head">
        <h2 id="progress-title">Progress</h2>
        <span class="final">Final grades: {{ p.finalCells }} of {{ p.expectedCells }} cells</span>
        @if (canLock()) {
          @if (p.locked) {
            <button mat-stroked-button type="button" (click)="unlock.emit()"><mat-icon aria-hidden="true">lock_open</mat-icon> Unlock grading</button>
          } @else {
            <button mat-stroked-button type="button" (click)="lock.emit()"><mat-icon aria-hidden="true">lock</mat-icon> Lock grading</button>
          }
        }
      </div>
      <ul class="graders">
        @for (g of graders(); track g.graderId) {
          <li>
            <span class="who">{{ g.name }}@if (g.designated) { <span class="tag">designated</span> }</span>
            <progress [max]="p.expectedCells || 1" [value]="g.gradedCells" [attr.aria-label]="g.name + ': ' + g.gradedCells + ' of ' + p.expectedCells + ' cells graded'"></progress>
            <span class="num">{{ g.gradedCells }} / {{ p.expectedCells }} ({{ g.share | percent }})</span>
          </li>
        } @empty {
          <li class="none">Nobody has graded this session yet. {{ p.expectedCells }} cells to grade (linemen × snaps).</li>
        }
      </ul>
      @if (lastLock(); as entry) {
        <p class="history">Last {{ entry.action === 'locked' ? 'locked' : 'unlocked' }} by {{ entry.by }}, {{ entry.at | date: 'd MMM y, HH:mm' }}@if (entry.reason) {: “{{ entry.reason }}”}</p>
      }
    </section>
  `,
  styles: `
    .progress {
      font: var(--mat-sys-body-small);
    }
    .head {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 4px 12px;
    }
    h2 {
      font: var(--mat-sys-title-small);
      margin: 0;
    }
    .final {
      flex: 1;
      color: var(--mat-sys-on-surface-variant);
    }
    .graders {
      list-style: none;
      margin: 4px 0 0;
      padding: 0;
    }
    li {
      display: grid;
      grid-template-columns: minmax(120px, 1fr) 2fr auto;
      align-items: center;
      gap: 8px;
    }
    progress {
      width: 100%;
      height: 10px;
      accent-color: var(--tw-field-green);
    }
    .tag {
      margin-left: 4px;
      padding: 0 4px;
      border: 1px solid var(--mat-sys-outline);
      border-radius: 4px;
    }
    .none {
      display: block;
      color: var(--mat-sys-on-surface-variant);
    }
    .history {
      margin: 4px 0 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class GradingProgressPanel {
  readonly progress = input.required<GradingProgress>();
  readonly canLock = input(false);
  readonly lock = output<void>();
  readonly unlock = output<void>();

  protected readonly graders = computed(() => {
    const p = this.progress();
    return [...p.graders]
      .sort((a, b) => Number(b.designated) - Number(a.designated) || b.gradedCells - a.gradedCells)
      .map((g) => ({ ...g, share: p.expectedCells > 0 ? g.gradedCells / p.expectedCells : 0 }));
  });
  protected readonly lastLock = computed(() => this.progress().lockHistory.at(-1) ?? null);
}
