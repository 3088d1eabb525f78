import type { LineDashboard } from './readiness-types';

const LINE_ORDER = ['LT', 'LG', 'C', 'RG', 'RT', 'TE'];

export interface MissedPivot {
  positions: string[];
  /** Most frequent reason first. */
  reasons: string[];
  count: (position: string, reason: string) => number;
  positionTotal: (position: string) => number;
  reasonTotal: (reason: string) => number;
  total: number;
}

/** Missed assignments as positions (left to right on the line) × reasons. */
export function missedPivot(rows: LineDashboard['missedAssignments']): MissedPivot {
  const cells = new Map<string, number>();
  const byPosition = new Map<string, number>();
  const byReason = new Map<string, number>();
  for (const r of rows) {
    cells.set(`${r.position}\u0000${r.reason}`, (cells.get(`${r.position}\u0000${r.reason}`) ?? 0) + r.count);
    byPosition.set(r.position, (byPosition.get(r.position) ?? 0) + r.count);
    byReason.set(r.reason, (byReason.get(r.reason) ?? 0) + r.count);
  }
  const rank = (p: string) => (LINE_ORDER.includes(p) ? LINE_ORDER.indexOf(p) : LINE_ORDER.length);
  const positions = [...byPosition.keys()].sort((a, b) => rank(a) - rank(b) || a.localeCompare(b));
  const reasons = [...byReason.keys()].sort((a, b) => byReason.get(b)! - byReason.get(a)! || a.localeCompare(b));
  return {
    positions,
    reasons,
    count: (p, r) => cells.get(`${p}\u0000${r}`) ?? 0,
    positionTotal: (p) => byPosition.get(p) ?? 0,
    reasonTotal: (r) => byReason.get(r) ?? 0,
    total: [...byPosition.values()].reduce((a, b) => a + b, 0),
  };
}
