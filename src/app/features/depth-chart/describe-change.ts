import { POSITIONS } from '@shared/roster';

export interface ChartEntry {
  position: string;
  rank: number;
  playerId: number;
}

/** GET /api/teams/{teamId}/depth-chart/history (server/grading/depth-chart.service.ts). */
export interface ChartChange {
  id: number;
  /** The week the change was saved for (0: the base chart). */
  week: number;
  by: string;
  at: string;
  reason: string | null;
  /** jsonb: the driver hands back parsed arrays, but a string is accepted too. */
  before: ChartEntry[] | string;
  after: ChartEntry[] | string;
}

function entries(value: ChartEntry[] | string | null | undefined): ChartEntry[] {
  if (Array.isArray(value)) return value;
  if (typeof value === 'string') {
    try {
      const parsed: unknown = JSON.parse(value);
      return Array.isArray(parsed) ? (parsed as ChartEntry[]) : [];
    } catch {
      return [];
    }
  }
  return [];
}

function byPosition(list: ChartEntry[]): Map<string, number[]> {
  const out = new Map<string, number[]>();
  for (const e of [...list].sort((a, b) => a.rank - b.rank)) {
    if (!out.has(e.position)) out.set(e.position, []);
    out.get(e.position)!.push(e.playerId);
  }
  return out;
}

/** One line per position whose order changed: "LG: Pike, Varga (was Varga, Pike)". */
export function describeChange(change: Pick<ChartChange, 'before' | 'after'>, nameOf: (playerId: number) => string): string[] {
  const before = byPosition(entries(change.before));
  const after = byPosition(entries(change.after));
  const order = [...POSITIONS, ...[...new Set([...before.keys(), ...after.keys()])].filter((p) => !(POSITIONS as readonly string[]).includes(p))];
  const names = (ids: number[] | undefined) => (ids && ids.length > 0 ? ids.map(nameOf).join(', ') : 'nobody');
  const lines: string[] = [];
  for (const p of order) {
    const a = before.get(p) ?? [];
    const b = after.get(p) ?? [];
    if (a.length === b.length && a.every((id, i) => id === b[i])) continue;
    lines.push(`${p}: ${names(b)} (was ${names(a)})`);
  }
  return lines;
}
