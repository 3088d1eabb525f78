import type { SnapResult } from '@shared/grading';
import type { GradeColumn } from './grade-columns';
import type { GradeDraft } from './grade-draft';

export type CellTone = 'plus' | 'minus' | 'none' | 'value';

/** How one cell reads: a symbol and a word (never colour alone), and the sentence a screen reader hears. */
export interface CellView {
  symbol: string;
  word: string;
  tone: CellTone;
  /** Second line, e.g. the missed reason. */
  detail: string;
  spoken: string;
}

const NOT_GRADED: Omit<CellView, 'spoken'> = { symbol: '○', word: 'not graded', tone: 'none', detail: '' };

function view(column: GradeColumn, v: Omit<CellView, 'spoken'>): CellView {
  const detail = v.detail ? `, ${v.detail}` : '';
  return { ...v, spoken: `${column.label}: ${v.tone === 'value' ? v.symbol + ' ' + v.word : v.word}${detail}`.trim() };
}

export function markView(mark: 'plus' | 'minus' | 'loaf' | null): Omit<CellView, 'spoken'> {
  if (mark === 'plus') return { symbol: '+', word: 'plus', tone: 'plus', detail: '' };
  if (mark === 'minus') return { symbol: '−', word: 'minus', tone: 'minus', detail: '' };
  if (mark === 'loaf') return { symbol: '⊘', word: 'loaf', tone: 'minus', detail: '' };
  return NOT_GRADED;
}

export function cellView(draft: GradeDraft, column: GradeColumn, result: SnapResult | null): CellView {
  switch (column.kind) {
    case 'assignment':
      if (draft.assignment === 'right') return view(column, { symbol: '✓', word: 'right', tone: 'plus', detail: '' });
      if (draft.assignment === 'missed') return view(column, { symbol: '✗', word: 'missed', tone: 'minus', detail: draft.missedReason ?? 'no reason yet' });
      return view(column, NOT_GRADED);
    case 'mark':
      return view(column, markView(typeof column.field === 'string' ? draft[column.field] : (draft.extra[column.field.extra] ?? null)));
    case 'effort':
      return view(column, markView(draft.effort));
    case 'count': {
      const n = draft[column.field];
      return view(column, { symbol: String(n), word: '', tone: n > 0 ? 'value' : 'none', detail: '' });
    }
    case 'penalties': {
      const n = draft.penalties.length;
      return view(column, { symbol: String(n), word: n === 0 ? 'none' : '', tone: n > 0 ? 'minus' : 'none', detail: draft.penalties.map((p) => p.type).join(', ') });
    }
    case 'note':
      return view(column, draft.note ? { symbol: '✎', word: 'note', tone: 'value', detail: draft.note } : { symbol: '', word: 'no note', tone: 'none', detail: '' });
    case 'result':
      if (result === 'plus') return view(column, { symbol: '+', word: 'plus', tone: 'plus', detail: '' });
      if (result === 'minus') return view(column, { symbol: '−', word: 'minus', tone: 'minus', detail: '' });
      return view(column, { symbol: '—', word: 'no result yet', tone: 'none', detail: '' });
  }
}

/** One line per part, for the conflict choice and the compare view. */
export function describeDraft(draft: GradeDraft, columns: readonly GradeColumn[]): { label: string; text: string }[] {
  return columns
    .filter((c) => c.kind !== 'result')
    .map((c) => {
      const v = cellView(draft, c, null);
      const text = c.kind === 'count' ? v.symbol : c.kind === 'penalties' ? (v.detail || 'none') : c.kind === 'note' ? (draft.note ?? '—') : `${v.symbol} ${v.word}${v.detail ? ' (' + v.detail + ')' : ''}`;
      return { label: c.label, text };
    });
}
