import { sql } from 'kysely';
import { mergeWatched } from '@shared/film-room';
import { inPositionGroup, type PositionGroup } from '@shared/film-room';
import type { AppContext } from '../core/context';
import { forbidden, notFound } from '../core/errors';
import type { TeamMembership } from '../core/route';
import { mediaUrl } from '../film/media-urls';
import { snapGradesOnClips } from '../grading/player-grades.service';
import { teamSharing } from '../teams/teams.service';
import { assertClipVisible, visibleClipIds } from './visibility';

/**
 * A player's study queue: every clip tagged to or shared with him, newest first, with the points
 * for him (and whether he acknowledged each), how much of the clip he has watched, and, when his
 * staff shares grades, his final grade on the clip's snap.
 */
export async function myClips(app: AppContext, membership: TeamMembership) {
  if (membership.playerId === null) throw forbidden('The study queue is for players.');
  const playerId = membership.playerId;
  const clips = await sql<{
    id: number; session_id: number; title: string; date: string; order: number | null; angle: string; poster_key: string | null; rendition_key: string | null; status: string; duration_ms: number | null; watched_ms: number | null; newest: Date | null;
  }>`
    SELECT c.id, c.session_id, s.title, s.date::text AS date, sn.order, c.angle, c.poster_key, c.rendition_key, c.status, c.duration_ms, v.watched_ms,
           (SELECT max(cc.created_at) FROM clip_comments cc JOIN comment_targets ct ON ct.comment_id = cc.id WHERE cc.clip_id = c.id AND ct.player_id = ${playerId}) AS newest
    FROM clips c
    JOIN film_sessions s ON s.id = c.session_id
    LEFT JOIN snaps sn ON sn.id = c.snap_id
    LEFT JOIN clip_views v ON v.clip_id = c.id AND v.player_id = ${playerId}
    WHERE c.team_id = ${membership.teamId} AND c.id IN (${visibleClipIds(app.db, playerId)})
    ORDER BY newest DESC NULLS LAST, s.date DESC, sn.order`.execute(app.db);
  const ids = clips.rows.map((c) => c.id);
  const comments = ids.length
    ? await app.db
        .selectFrom('clip_comments as c')
        .innerJoin('comment_targets as t', 't.comment_id', 'c.id')
        .innerJoin('users as u', 'u.id', 'c.author_id')
        .select((eb) => [
          'c.id', 'c.clip_id', 'c.at_ms', 'c.end_ms', 'c.kind', 'c.component', 'c.body', 'u.name', 't.acknowledged_at',
          eb.selectFrom('clip_comments as r').select(eb.fn.countAll<number>().as('n')).whereRef('r.parent_id', '=', 'c.id').where('r.hidden_at', 'is', null).as('replies'),
        ])
        .where('t.player_id', '=', playerId)
        .where('c.clip_id', 'in', ids)
        .where('c.hidden_at', 'is', null)
        .where('c.parent_id', 'is', null)
        .orderBy('c.at_ms')
        .execute()
    : [];
  const { gradesWithPlayers } = await teamSharing(app, membership.teamId);
  const grades = await snapGradesOnClips(app, membership.teamId, playerId, ids, gradesWithPlayers);
  return {
    gradesShared: gradesWithPlayers,
    clips: clips.rows.map((c) => ({
      clipId: c.id,
      sessionId: c.session_id,
      sessionTitle: c.title,
      sessionDate: c.date,
      snapOrder: c.order,
      angle: c.angle,
      posterUrl: c.poster_key ? mediaUrl(c.id, 'poster') : null,
      playbackUrl: c.status === 'ready' && c.rendition_key ? mediaUrl(c.id, 'playback') : null,
      durationMs: c.duration_ms,
      watchedFraction: c.duration_ms ? Math.min(1, (c.watched_ms ?? 0) / c.duration_ms) : 0,
      newest: (c.newest ?? new Date(0)).toISOString(),
      comments: comments
        .filter((x) => x.clip_id === c.id)
        .map((x) => ({ id: x.id, atMs: x.at_ms, endMs: x.end_ms, kind: x.kind, component: x.component, body: x.body, author: x.name, acknowledged: x.acknowledged_at !== null, replies: Number(x.replies ?? 0) })),
      grade: grades.get(c.id) ?? null,
    })),
  };
}

/** Records a stretch of a clip the player played; replays of the same moments count once. */
export async function recordView(app: AppContext, membership: TeamMembership, clipId: number, fromMs: number, toMs: number): Promise<{ watchedFraction: number }> {
  if (membership.playerId === null) return { watchedFraction: 0 };
  await assertClipVisible(app, membership, clipId);
  const clip = await app.db.selectFrom('clips').select('duration_ms').where('id', '=', clipId).executeTakeFirst();
  if (!clip) throw notFound('That clip');
  const duration = clip.duration_ms ?? Math.max(fromMs, toMs);
  return app.db.transaction().execute(async (trx) => {
    const existing = await trx.selectFrom('clip_views').select('ranges').where('clip_id', '=', clipId).where('player_id', '=', membership.playerId!).forUpdate().executeTakeFirst();
    const merged = mergeWatched([...(existing?.ranges ?? []), [fromMs, toMs]], duration);
    await trx
      .insertInto('clip_views')
      .values({ clip_id: clipId, player_id: membership.playerId!, ranges: JSON.stringify(merged.ranges), watched_ms: merged.coveredMs, last_seen_at: app.now() })
      .onConflict((oc) => oc.columns(['clip_id', 'player_id']).doUpdateSet({ ranges: JSON.stringify(merged.ranges), watched_ms: merged.coveredMs, last_seen_at: app.now() }))
      .execute();
    return { watchedFraction: duration > 0 ? merged.coveredMs / duration : 0 };
  });
}

/**
 * Before the meeting: per player of a position group, for one session's clips, how many clips and
 * points are his, how many he watched (≥ 90 % played), and how many points he acknowledged.
 */
export async function studyReport(app: AppContext, sessionId: number, group: PositionGroup = 'OL') {
  const session = await app.db.selectFrom('film_sessions').select(['team_id', 'season_id', 'title']).where('id', '=', sessionId).executeTakeFirst();
  if (!session) throw notFound('That film session');
  const roster = await app.db
    .selectFrom('roster_entries as r')
    .innerJoin('players as p', 'p.id', 'r.player_id')
    .select(['p.id', 'p.name', 'r.jersey', 'r.positions'])
    .where('r.season_id', '=', session.season_id)
    .where('r.status', '<>', 'inactive')
    .orderBy('r.jersey')
    .execute();
  const inGroup = roster.filter((r) => inPositionGroup(group, r.positions));
  const rows = await sql<{ player_id: number; points: number; acknowledged: number; clips: number; watched: number }>`
    SELECT t.player_id,
           count(DISTINCT c.id)::int AS points,
           count(DISTINCT c.id) FILTER (WHERE t.acknowledged_at IS NOT NULL)::int AS acknowledged,
           count(DISTINCT c.clip_id)::int AS clips,
           count(DISTINCT c.clip_id) FILTER (WHERE v.watched_ms >= 0.9 * coalesce(cl.duration_ms, 1))::int AS watched
    FROM comment_targets t
    JOIN clip_comments c ON c.id = t.comment_id AND c.parent_id IS NULL AND c.hidden_at IS NULL AND c.kind <> 'question'
    JOIN clips cl ON cl.id = c.clip_id AND cl.session_id = ${sessionId}
    LEFT JOIN clip_views v ON v.clip_id = c.clip_id AND v.player_id = t.player_id
    GROUP BY t.player_id`.execute(app.db);
  return {
    sessionId,
    sessionTitle: session.title,
    group,
    players: inGroup.map((p) => {
      const r = rows.rows.find((x) => x.player_id === p.id);
      return { playerId: p.id, name: p.name, jersey: p.jersey, clips: r?.clips ?? 0, watched: r?.watched ?? 0, points: r?.points ?? 0, acknowledged: r?.acknowledged ?? 0 };
    }),
  };
}
