import { verdict, type BenchResult } from './bench-result';

/** Figures with about three significant digits: 1234, 123, 12.3, 1.23, 0.123. */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const abs = Math.abs(value);
  if (abs >= 100) return value.toFixed(0);
  if (abs >= 10) return value.toFixed(1);
  if (abs >= 0.1) return value.toFixed(2);
  return value.toPrecision(2);
}

/**
 * One plain-text table for any set of results (issue 7's `npm run bench` prints all benchmarks
 * through this): name, value, baseline, ratio, goal, whether it is met, and the note.
 */
export function formatTable(results: readonly BenchResult[], title?: string): string {
  const header = ['benchmark', 'value', 'baseline', 'ratio', 'goal', '', 'note'];
  const rows = results.map((r) => {
    const v = verdict(r);
    return [
      r.name,
      `${formatNumber(r.value)} ${r.unit}`,
      r.baseline === undefined ? '' : `${formatNumber(r.baseline)} ${r.unit}`,
      r.ratio === undefined ? '' : `${r.ratio.toFixed(2)}×`,
      r.goal ?? '',
      v === 'met' ? 'ok' : v === 'missed' ? 'MISSED' : '',
      r.note ?? '',
    ];
  });
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((row) => row[i]!.length)));
  // Numbers right-aligned, text left-aligned; the note is last and never padded.
  const right = new Set([1, 2, 3]);
  const line = (cells: string[]) =>
    cells
      .map((cell, i) => (i === cells.length - 1 ? cell : right.has(i) ? cell.padStart(widths[i]!) : cell.padEnd(widths[i]!)))
      .join('  ')
      .trimEnd();
  const out = [line(header), widths.map((w, i) => (i === widths.length - 1 ? '-'.repeat(Math.min(w, 4)) : '-'.repeat(w))).join('  '), ...rows.map(line)];
  return `${title ? `${title}\n` : ''}${out.join('\n')}\n`;
}
