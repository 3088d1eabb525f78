import type { AppContext } from '../core/context';
import { studyReport } from '../film-room/study.service';
import { gradingProgress } from '../grading/progress.service';
import { resolveSeason } from '../teams/teams.service';

/**
 * The staff's home page: the next game, how far grading of the last game has come, and who has not
 * yet acknowledged his coaching points from it.
 */
export async function thisWeek(app: AppContext, teamId: number) {
  const season = await resolveSeason(app, teamId);
  const today = app.now().toISOString().slice(0, 10);
  const [next, last] = await Promise.all([
    app.db.selectFrom('film_sessions').select(['id', 'title', 'date', 'opponent', 'home_away', 'week']).where('team_id', '=', teamId).where('season_id', '=', season.id).where('kind', '=', 'game').where('date', '>', today).orderBy('date').limit(1).executeTakeFirst(),
    app.db.selectFrom('film_sessions').select(['id', 'title', 'date', 'opponent', 'week']).where('team_id', '=', teamId).where('season_id', '=', season.id).where('kind', '=', 'game').where('date', '<=', today).orderBy('date', 'desc').limit(1).executeTakeFirst(),
  ]);
  if (!last) return { seasonId: season.id, nextGame: next ?? null, lastGame: null, study: null };
  const [progress, report] = await Promise.all([gradingProgress(app, last.id), studyReport(app, last.id, 'OL')]);
  const behind = report.players.filter((p) => p.points > 0 && p.acknowledged < p.points);
  return {
    seasonId: season.id,
    nextGame: next ? { sessionId: next.id, title: next.title, date: next.date, opponent: next.opponent, homeAway: next.home_away, week: next.week } : null,
    lastGame: {
      sessionId: last.id,
      title: last.title,
      date: last.date,
      opponent: last.opponent,
      expectedCells: progress.expectedCells,
      finalCells: progress.finalCells,
      locked: progress.locked,
      graders: progress.graders,
    },
    study: { sessionId: last.id, playersWithPoints: report.players.filter((p) => p.points > 0).length, notCaughtUp: behind.map((p) => ({ playerId: p.playerId, name: p.name, jersey: p.jersey, points: p.points, acknowledged: p.acknowledged, watched: p.watched, clips: p.clips })) },
  };
}
