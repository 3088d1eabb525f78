import { sql } from 'kysely';
import { cohensKappa } from '@shared/stats';
import type { AppContext } from '../core/context';
import { notFound } from '../core/errors';

const COMPONENTS = { assignment: 'assignment', footwork: 'footwork', hands: 'hands', padLevel: 'pad_level', effort: 'effort' } as const;

/**
 * How closely two graders agree: Cohen's kappa per component over the snaps and players both
 * graded (a pair counts for a component only when both marked it), with the count compared and the
 * disagreements listed, newest first, to open on the desk.
 */
export async function graderAgreement(app: AppContext, teamId: number, graderA: number, graderB: number, seasonId?: number) {
  const members = await app.db.selectFrom('memberships').select('user_id').where('team_id', '=', teamId).where('user_id', 'in', [graderA, graderB]).execute();
  if (members.length !== new Set([graderA, graderB]).size) throw notFound('One of those graders');
  const rows = await sql<Record<string, string | number | null>>`
    SELECT a.snap_id, a.player_id, s.session_id, s."order", fs.title, p.name,
           a.assignment AS a_assignment, b.assignment AS b_assignment, a.footwork AS a_footwork, b.footwork AS b_footwork,
           a.hands AS a_hands, b.hands AS b_hands, a.pad_level AS a_pad_level, b.pad_level AS b_pad_level, a.effort AS a_effort, b.effort AS b_effort
    FROM grades a
    JOIN grades b ON b.snap_id = a.snap_id AND b.player_id = a.player_id AND b.grader_id = ${graderB}
    JOIN snaps s ON s.id = a.snap_id
    JOIN film_sessions fs ON fs.id = s.session_id
    JOIN players p ON p.id = a.player_id
    WHERE a.grader_id = ${graderA} AND fs.team_id = ${teamId} ${seasonId ? sql`AND fs.season_id = ${seasonId}` : sql``}
    ORDER BY fs.date DESC, s."order"`.execute(app.db);
  const components = Object.fromEntries(
    Object.entries(COMPONENTS).map(([name, column]) => {
      const pairs = rows.rows
        .filter((r) => r[`a_${column}`] !== null && r[`b_${column}`] !== null)
        .map((r) => [String(r[`a_${column}`]), String(r[`b_${column}`])] as [string, string]);
      const k = cohensKappa(pairs);
      return [name, { snaps: k.snaps, kappa: k.kappa, observed: k.observed, expected: k.expected, note: k.note }];
    }),
  );
  const disagreements = rows.rows
    .flatMap((r) =>
      Object.entries(COMPONENTS)
        .filter(([, column]) => r[`a_${column}`] !== null && r[`b_${column}`] !== null && r[`a_${column}`] !== r[`b_${column}`])
        .map(([name, column]) => ({ snapId: Number(r.snap_id), sessionId: Number(r.session_id), sessionTitle: String(r.title), snapOrder: Number(r.order), playerId: Number(r.player_id), playerName: String(r.name), component: name, a: String(r[`a_${column}`]), b: String(r[`b_${column}`]) })),
    )
    .slice(0, 500);
  return { graderA, graderB, components, disagreements };
}
