import type { PlayerGradeSheet, SnapGrade } from '@shared/api/player-grades';
import { componentLabel, componentOrder, type MarkValue } from '@shared/grade-marks';
import type { AppContext } from '../core/context';
import { forbidden, notFound } from '../core/errors';
import type { TeamMembership } from '../core/route';
import { buildGradeSheet } from './grade-sheet.service';
import { finalGradesOnClips, sessionForPlayer } from './player-grades.repository';
import { currentScheme } from './scheme.service';

/**
 * What a player may see of his own grades: his row of a session's Grade Sheet, and his final grade
 * on the snap of each clip in his Study Queue. Both only when his staff shares grades with players;
 * the numbers come from the final_grades view, whose rule is not repeated here.
 */

async function extraLabelsOf(app: AppContext, teamId: number): Promise<Map<string, string>> {
  const scheme = await currentScheme(app.db, teamId);
  // Retired parts stay in the scheme with their names: old grades still carry them.
  return new Map(scheme.rules.extraComponents.map((c) => [c.key, c.label]));
}

/** One player's row of the session's sheet. A player opens only his own; staff any player of the team. */
export async function playerGradeSheet(app: AppContext, sessionId: number, playerId: number, viewer: TeamMembership): Promise<PlayerGradeSheet> {
  if (viewer.role === 'player' && viewer.playerId !== playerId) throw forbidden('You can open only your own grade sheet.');
  const session = await sessionForPlayer(app.db, sessionId, playerId);
  if (!session) throw notFound('That film session');
  if (!session.player_on_team) throw notFound('That player');
  // Refuses a player when his staff does not share grades, and gives a player his own row only.
  const sheet = await buildGradeSheet(app, sessionId, viewer);
  const labels = await extraLabelsOf(app, session.team_id);
  return {
    sessionId,
    sessionTitle: session.title,
    sessionDate: session.date,
    winningThreshold: sheet.winningThreshold,
    extraLabels: Object.fromEntries(labels),
    player: sheet.players.find((p) => p.playerId === playerId) ?? null,
  };
}

type FinalGradeRow = Awaited<ReturnType<typeof finalGradesOnClips>>[number];

function toSnapGrade(row: FinalGradeRow, labels: ReadonlyMap<string, string>): SnapGrade {
  const fixed = new Map<string, string | null>([['assignment', row.assignment], ['footwork', row.footwork], ['hands', row.hands], ['padLevel', row.pad_level], ['effort', row.effort]]);
  // The team's own parts only where this grade marked them: in the scheme's order, then any no longer in it.
  const extras = new Map(Object.entries(row.extra ?? {}).filter(([, mark]) => mark !== null));
  const extraKeys = [...[...labels.keys()].filter((key) => extras.has(key)), ...[...extras.keys()].filter((key) => !labels.has(key))];
  return {
    result: row.result === 'plus' || row.result === 'minus' ? row.result : null,
    marks: componentOrder([...fixed.keys(), ...extraKeys]).map((key) => ({
      key,
      label: componentLabel(key, labels),
      mark: ((fixed.has(key) ? fixed.get(key) : extras.get(key)) ?? null) as MarkValue | null,
    })),
  };
}

/** His final grade on each clip's snap, by clip id; nothing when his staff does not share grades. */
export async function snapGradesOnClips(app: AppContext, teamId: number, playerId: number, clipIds: readonly number[], shared: boolean): Promise<Map<number, SnapGrade>> {
  if (!shared || clipIds.length === 0) return new Map();
  const [rows, labels] = await Promise.all([finalGradesOnClips(app.db, playerId, clipIds), extraLabelsOf(app, teamId)]);
  return new Map(rows.map((row) => [row.clip_id, toSnapGrade(row, labels)]));
}
