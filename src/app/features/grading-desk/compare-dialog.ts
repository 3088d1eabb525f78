import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import type { Grade, Scheme } from '@shared/api/grading';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { cellView } from './cell-view';
import { gradeColumns } from './grade-columns';
import { draftFromGrade } from './grade-draft';
import type { GridPlayer } from './grade-grid';

export interface CompareData {
  snapId: number;
  snapOrder: number;
  players: readonly GridPlayer[];
  scheme: Scheme;
}

interface CompareRow {
  name: string;
  byGrader: Map<number, { result: string; marks: string }>;
  verdict: 'agree' | 'differ' | 'one grader';
}

/** Every coach's grade of this snap side by side, so disagreements can be talked through. */
@Component({
  selector: 'tw-compare-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatDialogModule, StatePanel],
  template: `
    <h2 mat-dialog-title>Compare grades · snap {{ data.snapOrder }}</h2>
    <mat-dialog-content>
      <tw-state-panel [resource]="grades" loadingLabel="Loading every coach's grades…" emptyMessage="Nobody has graded this snap yet." [empty]="rows().length === 0" (retry)="grades.reload()" />
      @if (rows().length > 0) {
        <div class="tw-table-scroll">
          <table>
            <thead>
              <tr>
                <th scope="col">Lineman</th>
                @for (g of graders(); track g.id) {
                  <th scope="col">{{ g.name }}</th>
                }
                <th scope="col">Results</th>
              </tr>
            </thead>
            <tbody>
              @for (row of rows(); track row.name) {
                <tr>
                  <th scope="row">{{ row.name }}</th>
                  @for (g of graders(); track g.id) {
                    @let cell = row.byGrader.get(g.id);
                    <td>
                      @if (cell) {
                        <strong>{{ cell.result }}</strong>
                        <span class="marks">{{ cell.marks }}</span>
                      } @else {
                        <span class="marks">not graded</span>
                      }
                    </td>
                  }
                  <td [attr.data-verdict]="row.verdict">{{ row.verdict === 'differ' ? '≠ differ' : row.verdict === 'agree' ? '= agree' : '— one grader' }}</td>
                </tr>
              }
            </tbody>
          </table>
        </div>
        <p class="legend">A assignment, then each part: + plus, − minus, ○ not graded; E effort (⊘ loaf).</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-flat-button type="button" mat-dialog-close>Close</button>
    </mat-dialog-actions>
  `,
  styles: `
    table {
      border-collapse: collapse;
      width: 100%;
      font: var(--mat-sys-body-small);
    }
    th,
    td {
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      padding: 4px 8px;
      text-align: left;
      vertical-align: top;
    }
    .marks {
      display: block;
      font-family: monospace;
    }
    td[data-verdict='differ'] {
      font-weight: 700;
      background: var(--tw-amber-soft);
    }
    .legend {
      font: var(--mat-sys-body-small);
    }
  `,
})
export class CompareDialog {
  protected readonly data = inject<CompareData>(MAT_DIALOG_DATA);
  protected readonly grades = httpResource<{ grades: Grade[] }>(() => ({ url: `/api/snaps/${this.data.snapId}/grades`, context: inlineErrors() }));

  private readonly list = computed(() => (this.grades.hasValue() ? this.grades.value().grades : []));
  protected readonly graders = computed(() => {
    const seen = new Map<number, string>();
    for (const g of this.list()) seen.set(g.graderId, g.graderName);
    return [...seen].map(([id, name]) => ({ id, name }));
  });

  protected readonly rows = computed<CompareRow[]>(() => {
    const columns = gradeColumns(this.data.scheme).filter((c) => c.kind === 'assignment' || c.kind === 'mark' || c.kind === 'effort');
    const names = new Map(this.data.players.map((p) => [p.playerId, `${p.position} ${p.name}`]));
    const byPlayer = new Map<number, Grade[]>();
    for (const g of this.list()) byPlayer.set(g.playerId, [...(byPlayer.get(g.playerId) ?? []), g]);
    return [...byPlayer].map(([playerId, grades]) => {
      const byGrader = new Map(
        grades.map((g) => {
          const draft = draftFromGrade(g);
          const marks = columns.map((c) => `${c.kind === 'assignment' ? 'A' : c.kind === 'effort' ? 'E' : c.label[0]}${cellView(draft, c, null).symbol}`).join(' ');
          return [g.graderId, { result: g.result === 'plus' ? '+ plus' : g.result === 'minus' ? '− minus' : '— no result', marks }];
        }),
      );
      const results = new Set(grades.map((g) => g.result));
      const verdict: CompareRow['verdict'] = grades.length < 2 ? 'one grader' : results.size === 1 ? 'agree' : 'differ';
      return { name: names.get(playerId) ?? `Player ${playerId}`, byGrader, verdict };
    });
  });
}
