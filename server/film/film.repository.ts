import { sql } from 'kysely';
import type { Database } from '../../db/database';

export function findSessionTeam(db: Database, sessionId: number) {
  return db.selectFrom('film_sessions').select(['team_id', 'season_id']).where('id', '=', sessionId).executeTakeFirst();
}

export function findClipTeam(db: Database, clipId: number) {
  return db.selectFrom('clips').select(['team_id', 'session_id']).where('id', '=', clipId).executeTakeFirst();
}

export function findSnapTeam(db: Database, snapId: number) {
  return db
    .selectFrom('snaps')
    .innerJoin('film_sessions', 'film_sessions.id', 'snaps.session_id')
    .select(['film_sessions.team_id', 'snaps.session_id'])
    .where('snaps.id', '=', snapId)
    .executeTakeFirst();
}

/** Sessions of a season with their snap count, clip counts per state and a poster for the card. */
export function listSessions(db: Database, teamId: number, seasonId: number, kind?: string) {
  let query = db
    .selectFrom('film_sessions as s')
    .select((eb) => [
      's.id',
      's.team_id',
      's.season_id',
      's.kind',
      's.title',
      's.date',
      's.opponent',
      's.home_away',
      's.week',
      's.periods',
      eb.selectFrom('snaps').select(eb.fn.countAll<number>().as('n')).whereRef('snaps.session_id', '=', 's.id').as('snap_count'),
      eb
        .selectFrom('clips')
        .select(
          sql<Record<string, number>>`jsonb_build_object(
            'received', count(*) FILTER (WHERE status = 'received'),
            'processing', count(*) FILTER (WHERE status = 'processing'),
            'ready', count(*) FILTER (WHERE status = 'ready'),
            'failed', count(*) FILTER (WHERE status = 'failed'))`.as('c'),
        )
        .whereRef('clips.session_id', '=', 's.id')
        .as('clip_counts'),
      eb
        .selectFrom('clips')
        .select('clips.id')
        .whereRef('clips.session_id', '=', 's.id')
        .where('clips.poster_key', 'is not', null)
        .orderBy('clips.upload_order')
        .limit(1)
        .as('poster_clip_id'),
    ])
    .where('s.team_id', '=', teamId)
    .where('s.season_id', '=', seasonId);
  if (kind) query = query.where('s.kind', '=', kind);
  return query.orderBy('s.date', 'desc').orderBy('s.id', 'desc').execute();
}

export type SessionRow = Awaited<ReturnType<typeof listSessions>>[number];

export function findSessionRow(db: Database, sessionId: number) {
  return db
    .selectFrom('film_sessions')
    .select('season_id')
    .where('id', '=', sessionId)
    .executeTakeFirst()
    .then(async (found) => {
      if (!found) return undefined;
      const team = await findSessionTeam(db, sessionId);
      return (await listSessions(db, team!.team_id, found.season_id)).find((s) => s.id === sessionId);
    });
}

const CLIP_COLUMNS = [
  'id',
  'team_id',
  'session_id',
  'snap_id',
  'kind',
  'angle',
  'upload_order',
  'original_name',
  'status',
  'failure_reason',
  'progress',
  'sha256',
  'size_bytes',
  'original_key',
  'poster_key',
  'strip_key',
  'strip',
  'rendition_key',
  'duration_ms',
  'width',
  'height',
  'fps',
  'proposed_cuts',
  'source_clip_id',
  'created_at',
] as const;

export function findClip(db: Database, clipId: number) {
  return db.selectFrom('clips').select(CLIP_COLUMNS).where('id', '=', clipId).executeTakeFirst();
}

export function listSessionClips(db: Database, sessionId: number) {
  return db.selectFrom('clips').select(CLIP_COLUMNS).where('session_id', '=', sessionId).orderBy('upload_order').execute();
}

export type ClipRow = NonNullable<Awaited<ReturnType<typeof findClip>>>;

export function listSnaps(db: Database, sessionId: number) {
  return db.selectFrom('snaps').selectAll().where('session_id', '=', sessionId).orderBy('order').execute();
}

export type SnapRow = Awaited<ReturnType<typeof listSnaps>>[number];

export function listSnapClips(db: Database, sessionId: number) {
  return db
    .selectFrom('clips')
    .select(['id', 'snap_id', 'angle', 'status', 'poster_key'])
    .where('session_id', '=', sessionId)
    .where('snap_id', 'is not', null)
    .orderBy('angle')
    .execute();
}
