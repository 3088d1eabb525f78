import { sql } from 'kysely';
import { tallyBySession, tallyByWeek, weeklyTrend } from '@shared/stats';
import { sessionTallies } from '../server/development/development.repository';
import { getMailPreferences, unsubscribeLink } from '../server/film-room/digest.service';
import { weeklySummaryMail } from '../server/mail/templates';
import { findCurrentSeason } from '../server/teams/teams.repository';
import type { JobHandler } from './handlers';

/** Sessions listed in the mail, newest first. */
const SESSIONS_LISTED = 6;
const pct = (rate: number | null) => (rate === null ? '—' : `${Math.round(100 * rate)} %`);

/**
 * The weekly development summary: each player's plus rate by session this season (final grades),
 * the weekly trend read the same way as on his Progress page, and his coach's open goals, to every
 * player of the team who has not turned it off.
 */
export const sendWeeklySummaries: JobHandler<'summary.weekly'> = async (deps, { teamId }) => {
  const { db, config, logger } = deps;
  const season = await findCurrentSeason(db, teamId);
  if (!season) {
    logger.info({ event: 'weekly_summaries_skipped', teamId }, 'weekly summaries skipped: the team has no current season');
    return;
  }
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
    const sessions = tallyBySession(await sessionTallies(db, p.playerId, season.id));
    const trend = weeklyTrend(tallyByWeek(sessions));
    const goals = await sql<{ component: string; target: number; due_on: string | null }>`
      SELECT component, target, due_on::text FROM player_goals WHERE player_id = ${p.playerId} AND achieved_at IS NULL ORDER BY due_on NULLS LAST`.execute(db);
    const lines = [
      ...(sessions.length === 0
        ? [`No graded snaps yet in the ${season.name} season.`]
        : [
            `Your trend over ${trend.weeks} ${trend.weeks === 1 ? 'week' : 'weeks'}: ${trend.reading}.`,
            'Plus rate, newest first:',
            ...sessions
              .slice(-SESSIONS_LISTED)
              .reverse()
              .map((s) => `  ${s.date} ${s.title}: ${pct(s.rate)} of ${s.snaps} snaps`),
          ]),
      ...(goals.rows.length > 0 ? ['Your goals:', ...goals.rows.map((g) => `  ${g.component}: ${Math.round(Number(g.target) * 100)} %${g.due_on ? ` by ${g.due_on}` : ''}`)] : []),
    ];
    await deps.mailer.send(weeklySummaryMail({ to: p.email, playerName: p.name, lines, link: `${config.publicUrl}/progress/${p.playerId}`, unsubscribeLink: unsubscribeLink(deps, p.userId, 'weekly') }));
    sent += 1;
  }
  logger.info({ event: 'weekly_summaries_sent', teamId, sent }, 'weekly summaries sent');
};

/**
 * The weekly schedule's tick (pg-boss cron, see workers/main.ts): one summary job per team that has
 * players. A singleton key per team keeps a repeated tick from mailing twice within 12 hours (pg-boss
 * allows no longer throttle than its archive interval; the cron itself ticks once a week).
 */
export const enqueueWeeklySummaries: JobHandler<'summary.weekly-all'> = async (deps) => {
  const teams = await deps.db
    .selectFrom('memberships')
    .select('team_id')
    .distinct()
    .where('role', '=', 'player')
    .where('active', '=', true)
    .execute();
  for (const { team_id } of teams) {
    await deps.jobs.send('summary.weekly', { teamId: team_id }, undefined, { singletonKey: `weekly-${team_id}`, singletonSeconds: 12 * 3600 });
  }
  deps.logger.info({ event: 'weekly_summaries_enqueued', teams: teams.length }, 'weekly summaries enqueued');
};
