import { stringify } from 'csv-stringify/sync';
import type { GradeSheet, GradeSheetPlayer } from '@shared/api/grading';
import { BASE_COMPONENTS, COMPONENT_LABELS, plusRate } from '@shared/grading';
import { defuseCell } from '@shared/csv-cells';
import { linemanResults, resultScores, unitGrade, unitSnapOutcome, weakestLink } from '@shared/stats';
import type { AppContext } from '../core/context';
import { forbidden, notFound } from '../core/errors';
import type { TeamMembership } from '../core/route';
import { participantsBySnap } from './desk.service';
import { extraTotals, gradeNotes, missedByReason, penaltiesByType, playerTotals, snapTotals } from './grade-sheet.repository';
import { currentScheme } from './scheme.service';

const n = (v: unknown) => Number(v ?? 0);

/**
 * One session's grade sheet from the final grades (server/grading: final_grades view): per player
 * snaps, plus rate, each component's plus rate (plus ÷ (plus + minus), not graded counts in neither;
 * for assignment plus = right; for effort a loaf counts as minus), counts and notes; and the unit
 * view: snaps on which every lineman on the field graded plus (the shared rule, unitSnapOutcome), with
 * each snap's weakest link.
 */
export async function buildGradeSheet(app: AppContext, sessionId: number, viewer: TeamMembership): Promise<GradeSheet> {
  const session = await app.db
    .selectFrom('film_sessions')
    .innerJoin('teams', 'teams.id', 'film_sessions.team_id')
    .select(['film_sessions.team_id', 'film_sessions.season_id', 'film_sessions.week', 'teams.share_grades_with_players'])
    .where('film_sessions.id', '=', sessionId)
    .executeTakeFirst();
  if (!session) throw notFound('That film session');
  if (viewer.role === 'player' && (!session.share_grades_with_players || viewer.playerId === null)) throw forbidden('Your staff has not shared grades with players.');
  const [totals, extras, missed, penalties, notes, bySnap, participants, scheme, roster] = await Promise.all([
    playerTotals(app.db, sessionId),
    extraTotals(app.db, sessionId),
    missedByReason(app.db, sessionId),
    penaltiesByType(app.db, sessionId),
    gradeNotes(app.db, sessionId),
    snapTotals(app.db, sessionId),
    participantsBySnap(app.db, sessionId, session.season_id, session.week),
    currentScheme(app.db, session.team_id),
    app.db
      .selectFrom('players as p')
      .leftJoin('roster_entries as r', (j) => j.onRef('r.player_id', '=', 'p.id').on('r.season_id', '=', session.season_id))
      .select(['p.id', 'p.name', 'r.jersey', 'r.positions'])
      .where('p.team_id', '=', session.team_id)
      .execute(),
  ]);
  const threshold = scheme.rules.winningThreshold;
  const played = new Map<number, number>();
  for (const snap of participants) for (const p of snap.participants) played.set(p.playerId, (played.get(p.playerId) ?? 0) + 1);

  const players: GradeSheetPlayer[] = totals.map((t) => {
    const info = roster.find((r) => r.id === t.player_id);
    const tallyOf = (plus: unknown, minus: unknown) => ({ plus: n(plus), minus: n(minus), rate: plusRate(n(plus), n(minus)) });
    const components: GradeSheetPlayer['components'] = {
      assignment: tallyOf(t.assignment_plus, t.assignment_minus),
      footwork: tallyOf(t.footwork_plus, t.footwork_minus),
      hands: tallyOf(t.hands_plus, t.hands_minus),
      padLevel: tallyOf(t.pad_level_plus, t.pad_level_minus),
      effort: tallyOf(t.effort_plus, t.effort_minus),
    };
    for (const e of extras.filter((x) => x.player_id === t.player_id)) {
      const entry = components[e.key] ?? { plus: 0, minus: 0, rate: null };
      if (e.value === 'plus') entry.plus += e.n;
      else entry.minus += e.n;
      entry.rate = plusRate(entry.plus, entry.minus);
      components[e.key] = entry;
    }
    const snaps = n(t.snaps);
    const plus = n(t.plus);
    const rate = snaps === 0 ? null : plus / snaps;
    return {
      playerId: t.player_id,
      name: info?.name ?? 'Unknown player',
      jersey: info?.jersey ?? null,
      positions: info?.positions ?? [],
      snapsPlayed: Math.max(played.get(t.player_id) ?? 0, snaps),
      snaps,
      plus,
      plusRate: rate,
      meetsWinningGrade: rate === null ? null : rate >= threshold,
      components,
      missedAssignments: n(t.assignment_minus),
      missedByReason: Object.fromEntries(missed.filter((m) => m.player_id === t.player_id).map((m) => [m.missed_reason ?? 'no reason given', n(m.n)])),
      knockdowns: n(t.knockdowns),
      pressuresAllowed: n(t.pressures_allowed),
      sacksAllowed: n(t.sacks_allowed),
      penalties: n(t.penalties),
      penaltiesByType: Object.fromEntries(penalties.filter((p) => p.player_id === t.player_id).map((p) => [p.type, n(p.n)])),
      notes: notes.filter((x) => x.player_id === t.player_id).map((x) => ({ snapOrder: x.order, note: x.note! })),
    };
  });
  players.sort((a, b) => (a.jersey ?? 999) - (b.jersey ?? 999));

  const unitSnaps = participants.map((snap) => {
    const totalsOfSnap = bySnap.find((s) => s.snap_id === snap.snapId);
    const plusPlayerIds = (totalsOfSnap?.plus_player_ids ?? []).map(Number);
    const minusPlayerIds = (totalsOfSnap?.minus_player_ids ?? []).map(Number);
    const counts = { onField: snap.participants.length, graded: plusPlayerIds.length + minusPlayerIds.length, plus: plusPlayerIds.length };
    const outcome = unitSnapOutcome(counts);
    return {
      snapId: snap.snapId,
      order: snap.order,
      ...counts,
      counted: outcome !== 'incomplete',
      allPlus: outcome === 'allPlus',
      minusPlayerIds,
      weakestLinkIds: (weakestLink(resultScores(linemanResults(plusPlayerIds, minusPlayerIds)))?.playerIds ?? []).map(Number),
    };
  });
  const unit = unitGrade(unitSnaps);
  const visible = viewer.role === 'player' ? players.filter((p) => p.playerId === viewer.playerId) : players;
  return {
    sessionId,
    winningThreshold: threshold,
    players: visible,
    unit:
      viewer.role === 'player'
        ? { snaps: 0, allPlus: 0, incomplete: 0, rate: null, bySnap: [] }
        : { snaps: unit.counted, allPlus: unit.allPlus, incomplete: unit.incomplete, rate: unit.rate, bySnap: unitSnaps },
  };
}

const pct = (rate: number | null) => (rate === null ? '' : (Math.round(rate * 1000) / 10).toFixed(1));

/** The sheet as CSV, our own columns; percentages with one decimal. */
export function gradeSheetCsv(sheet: GradeSheet): string {
  const componentKeys = [...new Set(['assignment', ...BASE_COMPONENTS, 'effort', ...sheet.players.flatMap((p) => Object.keys(p.components))])];
  const header = ['jersey', 'player', 'snaps', 'plus', 'plus_pct', 'winning_grade', ...componentKeys.map((k) => `${k}_pct`), 'missed_assignments', 'knockdowns', 'pressures_allowed', 'sacks_allowed', 'penalties'];
  const rows = sheet.players.map((p) => [
    p.jersey ?? '',
    defuseCell(p.name),
    p.snaps,
    p.plus,
    pct(p.plusRate),
    p.meetsWinningGrade === null ? '' : p.meetsWinningGrade ? 'met' : 'not met',
    ...componentKeys.map((k) => pct(p.components[k]?.rate ?? null)),
    p.missedAssignments,
    p.knockdowns,
    p.pressuresAllowed,
    p.sacksAllowed,
    p.penalties,
  ]);
  return stringify([header, ...rows]);
}

export { COMPONENT_LABELS };
