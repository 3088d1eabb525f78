import type { FilmSession, FilmSessionCreate } from '@shared/api/film';
import type { SessionKind } from '@shared/film';
import type { AppContext } from '../core/context';
import { notFound } from '../core/errors';
import { resolveSeason } from '../teams/teams.service';
import { findSessionRow, listSessions, type SessionRow } from './film.repository';
import { mediaUrl } from './media-urls';

function toSession(row: SessionRow): FilmSession {
  const counts = (row.clip_counts ?? {}) as Record<string, number>;
  return {
    id: row.id,
    teamId: row.team_id,
    seasonId: row.season_id,
    kind: row.kind as SessionKind,
    title: row.title,
    date: row.date,
    opponent: row.opponent,
    homeAway: row.home_away as FilmSession['homeAway'],
    week: row.week,
    periods: row.periods,
    snapCount: Number(row.snap_count ?? 0),
    clipCounts: {
      received: Number(counts.received ?? 0),
      processing: Number(counts.processing ?? 0),
      ready: Number(counts.ready ?? 0),
      failed: Number(counts.failed ?? 0),
    },
    posterUrl: row.poster_clip_id ? mediaUrl(row.poster_clip_id, 'poster') : null,
  };
}

export async function createFilmSession(app: AppContext, userId: number, input: FilmSessionCreate): Promise<FilmSession> {
  const season = await resolveSeason(app, input.teamId, input.seasonId);
  const row = await app.db
    .insertInto('film_sessions')
    .values({
      team_id: input.teamId,
      season_id: season.id,
      kind: input.kind,
      title: input.title,
      date: input.date,
      opponent: input.opponent ?? null,
      home_away: input.homeAway ?? null,
      week: input.week ?? null,
      periods: input.periods ?? [],
      created_by: userId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return getFilmSession(app, row.id);
}

export async function getFilmSession(app: AppContext, sessionId: number): Promise<FilmSession> {
  const row = await findSessionRow(app.db, sessionId);
  if (!row) throw notFound('That film session');
  return toSession(row);
}

export async function listFilmSessions(app: AppContext, teamId: number, seasonId?: number, kind?: SessionKind): Promise<{ sessions: FilmSession[]; seasonId: number }> {
  const season = await resolveSeason(app, teamId, seasonId);
  return { sessions: (await listSessions(app.db, teamId, season.id, kind)).map(toSession), seasonId: season.id };
}

export async function updateFilmSession(
  app: AppContext,
  sessionId: number,
  change: { title?: string; date?: string; opponent?: string | null; homeAway?: 'home' | 'away' | 'neutral' | null; week?: number | null; periods?: string[] },
): Promise<FilmSession> {
  const values = {
    ...(change.title !== undefined ? { title: change.title } : {}),
    ...(change.date !== undefined ? { date: change.date } : {}),
    ...(change.opponent !== undefined ? { opponent: change.opponent } : {}),
    ...(change.homeAway !== undefined ? { home_away: change.homeAway } : {}),
    ...(change.week !== undefined ? { week: change.week } : {}),
    ...(change.periods !== undefined ? { periods: change.periods } : {}),
  };
  if (Object.keys(values).length > 0) await app.db.updateTable('film_sessions').set(values).where('id', '=', sessionId).execute();
  return getFilmSession(app, sessionId);
}
