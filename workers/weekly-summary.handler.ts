import { sql } from 'kysely';
import { getMailPreferences, unsubscribeLink } from '../server/film-room/digest.service';
import { weeklySummaryMail } from '../server/mail/templates';
import type { JobHandler } from './handlers';

const pct = (plus: number, snaps: number) => (snaps === 0 ? '—' : `${Math.round((100 * plus) / snaps)} %`);

/**
 * The weekly development summary: each player's plus rate over his last graded sessions (from the
 * final grades) and his coach's open goals, to every player of the team who has not turned it off.
 */
export const sendWeeklySummaries: JobHandler<'summary.weekly'> = async (deps, { teamId }) => {
  const { db, config, logger } = deps;
  const players = await db
    .selectFrom('memberships')
    .innerJoin('users', 'users.id', 'memberships.user_id')
    .innerJoin('players', 'players.id', 'memberships.player_id')
    .select(['users.id as userId', 'users.email', 'players.id as playerId', 'players.name'])
    .where('memberships.team_id', '=', teamId)
    .where('memberships.role', '=', 'player')
    .where('memberships.active', '=', true)
    .execute();
  let sent = 0;
  for (const p of players) {
    if (!(await getMailPreferences(deps, p.userId)).weeklySummary) continue;
    const sessions = await sql<{ title: string; date: string; snaps: number; plus: number }>`
      SELECT fs.title, fs.date::text AS date, count(*) FILTER (WHERE g.result IS NOT NULL)::int AS snaps, count(*) FILTER (WHERE g.result = 'plus')::int AS plus
      FROM final_grades g JOIN film_sessions fs ON fs.id = g.session_id
      WHERE g.player_id = ${p.playerId} AND fs.team_id = ${teamId}
      GROUP BY fs.id, fs.title, fs.date ORDER BY fs.date DESC LIMIT 6`.execute(db);
    const goals = await sql<{ component: string; target: number; due_on: string | null }>`
      SELECT component, target, due_on::text FROM player_goals WHERE player_id = ${p.playerId} AND achieved_at IS NULL ORDER BY due_on NULLS LAST`.execute(db);
    const lines = [
      sessions.rows.length === 0 ? 'No graded snaps yet this season.' : 'Plus rate, newest first:',
      ...sessions.rows.map((s) => `  ${s.date} ${s.title}: ${pct(s.plus, s.snaps)} of ${s.snaps} snaps`),
      ...(goals.rows.length > 0 ? ['Your goals:', ...goals.rows.map((g) => `  ${g.component}: ${Math.round(Number(g.target) * 100)} %${g.due_on ? ` by ${g.due_on}` : ''}`)] : []),
    ];
    await deps.mailer.send(weeklySummaryMail({ to: p.email, playerName: p.name, lines, link: `${config.publicUrl}/progress/${p.playerId}`, unsubscribeLink: unsubscribeLink(deps, p.userId, 'weekly') }));
    sent += 1;
  }
  logger.info({ event: 'weekly_summaries_sent', teamId, sent }, 'weekly summaries sent');
};
