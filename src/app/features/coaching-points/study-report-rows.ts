/** One player's line of the Study Report (GET /api/film-sessions/{id}/study-report). */
export interface StudyReportRow {
  playerId: number;
  name: string;
  jersey: number | null;
  clips: number;
  watched: number;
  points: number;
  acknowledged: number;
}

export interface StudyReport {
  sessionId: number;
  sessionTitle: string;
  group: string;
  players: StudyReportRow[];
}

export type ReportSortKey = 'player' | 'clips' | 'watched' | 'points' | 'acknowledged';
export type SortDirection = 'asc' | 'desc';

/** Share of his clips watched (or points acknowledged); nothing to do counts as done. */
function share(done: number, of: number): number {
  return of === 0 ? 1 : done / of;
}

const VALUE: Record<ReportSortKey, (row: StudyReportRow) => number | string> = {
  player: (r) => r.jersey ?? 1000,
  clips: (r) => r.clips,
  watched: (r) => share(r.watched, r.clips),
  points: (r) => r.points,
  acknowledged: (r) => share(r.acknowledged, r.points),
};

/** Sorted by a column (watched and acknowledged by their share), ties by jersey then name. */
export function sortReport(rows: readonly StudyReportRow[], key: ReportSortKey, direction: SortDirection): StudyReportRow[] {
  const sign = direction === 'asc' ? 1 : -1;
  const value = VALUE[key];
  return [...rows].sort((a, b) => {
    const x = value(a);
    const y = value(b);
    const primary = x < y ? -1 : x > y ? 1 : 0;
    return sign * primary || (a.jersey ?? 1000) - (b.jersey ?? 1000) || a.name.localeCompare(b.name);
  });
}

/** "3 of 4 watched"; "no clips" when he has none in this session. */
export function ofWords(done: number, of: number, verb: string, none: string): string {
  return of === 0 ? none : `${done} of ${of} ${verb}`;
}

/** Whether he still has something to do before the meeting. */
export function behind(row: StudyReportRow): boolean {
  return row.watched < row.clips || row.acknowledged < row.points;
}
