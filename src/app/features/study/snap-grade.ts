import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { SnapGrade } from '@shared/api/player-grades';
import { markWords } from '@shared/grade-marks';

/** Marks whose word must be read, not guessed from a symbol shared with another mark. */
const SPELLED = new Set(['missed', 'loaf']);

/**
 * His final grade on one snap: the result in a word with a symbol, then each marked part as a chip.
 * Colour only repeats what the symbol and the words say.
 */
@Component({
  selector: 'tw-snap-grade',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let r = result();
    <span class="result" [attr.data-result]="r.state" data-testid="snap-result"><span aria-hidden="true">{{ r.symbol }}</span> {{ r.text }}</span>
    @if (marks().length > 0) {
      <span class="marks" role="list" aria-label="Parts of the grade">
        @for (m of marks(); track m.key) {
          <span class="mark" role="listitem" [attr.data-good]="m.good" data-testid="snap-mark">
            <span aria-hidden="true">{{ m.symbol }}</span> {{ m.label }}
            @if (m.spelled) {
              {{ m.word }}
            } @else {
              <span class="tw-visually-hidden">{{ m.word }}</span>
            }
          </span>
        }
      </span>
    }
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      gap: 4px;
    }
    .result {
      font: var(--mat-sys-title-small);
      align-self: flex-start;
      padding: 0 8px;
      border-radius: 8px;
      border: 1px solid currentColor;
    }
    .result[data-result='plus'] {
      color: #164430;
      background: var(--tw-ok-soft);
    }
    .result[data-result='minus'] {
      color: #5c0b06;
      background: var(--tw-danger-soft);
    }
    .result[data-result='none'] {
      color: var(--mat-sys-on-surface-variant);
    }
    .marks {
      display: flex;
      flex-wrap: wrap;
      gap: 4px;
    }
    .mark {
      font: var(--mat-sys-body-small);
      padding: 1px 6px;
      border-radius: 6px;
      background: var(--mat-sys-surface-container);
      color: var(--tw-slate-ink);
    }
    .mark[data-good='true'] {
      background: var(--tw-ok-soft);
    }
    .mark[data-good='false'] {
      background: var(--tw-danger-soft);
    }
  `,
})
export class SnapGradeView {
  readonly grade = input.required<SnapGrade>();

  protected readonly result = computed(() => {
    const result = this.grade().result;
    if (result === null) return { state: 'none', symbol: '·', text: 'No result yet' };
    return { state: result, symbol: markWords(result).symbol, text: result === 'plus' ? 'Plus on this snap' : 'Minus on this snap' };
  });

  /** Only the parts the coach marked; "not graded" parts would crowd a phone screen. */
  protected readonly marks = computed(() =>
    this.grade()
      .marks.filter((m) => m.mark !== null)
      .map((m) => ({ key: m.key, label: m.label, ...markWords(m.mark), spelled: SPELLED.has(m.mark!) })),
  );
}
