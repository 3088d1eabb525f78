import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { GradeSheet } from '@shared/api/grading';
import { formatRate } from './sheet-format';

/** The whole line, snap by snap: all plus, or who graded minus and who was the weakest link. */
@Component({
  selector: 'tw-unit-sheet',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let u = sheet().unit;
    <section class="sheet-card" aria-labelledby="unit-title">
      <h2 id="unit-title">Whole line</h2>
      <p class="headline">
        <span class="big">{{ rate(u.rate) }}</span>
        <span>of snaps with every lineman plus ({{ u.allPlus }} of {{ u.snaps }} fully graded snaps)</span>
      </p>
      @if (u.incomplete > 0) {
        <p class="hint">{{ u.incomplete }} {{ u.incomplete === 1 ? 'snap waits' : 'snaps wait' }} for every lineman on the field to be graded before it counts.</p>
      }
      <table>
        <thead>
          <tr>
            <th scope="col">Snap</th><th scope="col">Graded</th><th scope="col">+ plus</th><th scope="col">Line</th><th scope="col">Minus from</th>
            <th scope="col">Weakest link</th>
          </tr>
        </thead>
        <tbody>
          @for (s of rows(); track s.snapId) {
            <tr [attr.data-all-plus]="s.allPlus">
              <th scope="row">{{ s.order }}</th>
              <td>{{ s.graded }} of {{ s.onField }}</td>
              <td>{{ s.plus }}</td>
              <td>{{ s.graded === 0 ? '○ not graded' : !s.counted ? '… grading' : s.allPlus ? '✓ all plus' : '✗ not all plus' }}</td>
              <td>{{ s.minusNames || '—' }}</td>
              <td>{{ s.weakestNames || '—' }}</td>
            </tr>
          } @empty {
            <tr><td colspan="6">No snaps graded yet.</td></tr>
          }
        </tbody>
      </table>
    </section>
  `,
  styles: `
    .sheet-card {
      display: block;
      background: var(--mat-sys-surface-container-lowest);
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      padding: 12px 16px;
    }
    h2 {
      font: var(--mat-sys-title-medium);
      margin: 0;
    }
    .headline {
      display: flex;
      gap: 12px;
      align-items: baseline;
    }
    .hint {
      font: var(--mat-sys-body-small);
      margin: 0 0 8px;
    }
    .big {
      font: var(--mat-sys-headline-small);
      font-weight: 700;
    }
    table {
      border-collapse: collapse;
      width: 100%;
      font: var(--mat-sys-body-medium);
    }
    th,
    td {
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      padding: 2px 8px;
      text-align: left;
    }
    tr[data-all-plus='false'] td:nth-child(4) {
      font-weight: 700;
    }
  `,
})
export class UnitSheet {
  readonly sheet = input.required<GradeSheet>();
  protected readonly rate = formatRate;

  protected readonly rows = computed(() => {
    const sheet = this.sheet();
    const names = new Map(sheet.players.map((p) => [p.playerId, p.jersey !== null ? `#${p.jersey} ${p.name}` : p.name]));
    const named = (ids: number[]) => ids.map((id) => names.get(id) ?? `Player ${id}`).join(', ');
    return [...sheet.unit.bySnap].sort((a, b) => a.order - b.order).map((s) => ({ ...s, minusNames: named(s.minusPlayerIds), weakestNames: named(s.weakestLinkIds) }));
  });
}
