import { sql } from 'kysely';
import type { CutupFilter } from '@shared/api/film-room';
import type { PositionGroup } from '@shared/film-room';
import type { AppContext } from '../core/context';
import { notFound, validationFailed } from '../core/errors';
import type { TeamMembership } from '../core/route';
import { mediaUrl } from '../film/media-urls';
import { visibleClipIds } from './visibility';

const GRADE_COLUMN: Record<NonNullable<CutupFilter['component']>, string> = {
  assignment: 'assignment', footwork: 'footwork', hands: 'hands', padLevel: 'pad_level', effort: 'effort',
};

/**
 * The clips a filter picks, in session date and snap order: by sessions, concepts, fronts, angle, and
 * for one player the snaps where his final grade marked a component plus or minus (e.g. every snap
 * of his graded minus on pad level). Team-scoped; one query.
 */
export async function clipsForFilter(app: AppContext, teamId: number, filter: CutupFilter) {
  const gradeMark = filter.mark === 'plus' ? (filter.component === 'assignment' ? 'right' : 'plus') : filter.component === 'assignment' ? 'missed' : 'minus';
  let query = app.db
    .selectFrom('clips as c')
    .innerJoin('snaps as s', 's.id', 'c.snap_id')
    .innerJoin('film_sessions as fs', 'fs.id', 'c.session_id')
    .select(['c.id', 'c.session_id', 's.order', 'c.angle', 'fs.title', 'fs.date'])
    .where('c.team_id', '=', teamId)
    .where('c.status', '=', 'ready');
  if (filter.sessionIds?.length) query = query.where('c.session_id', 'in', filter.sessionIds);
  if (filter.conceptIds?.length) query = query.where('s.concept_id', 'in', filter.conceptIds);
  if (filter.frontIds?.length) query = query.where('s.front_id', 'in', filter.frontIds);
  if (filter.angle) query = query.where('c.angle', '=', filter.angle);
  if (filter.playerId !== undefined) {
    const playerId = filter.playerId;
    query = query.where(({ exists, selectFrom }) =>
      exists(
        selectFrom('final_grades as g')
          .select('g.id')
          .whereRef('g.snap_id', '=', 's.id')
          .where('g.player_id', '=', playerId)
          .$if(filter.component !== undefined, (q) => q.where(sql.ref(`g.${GRADE_COLUMN[filter.component!]}`), filter.component === 'effort' && filter.mark !== 'plus' ? 'in' : '=', filter.component === 'effort' && filter.mark !== 'plus' ? ['minus', 'loaf'] : gradeMark)),
      ),
    );
  }
  const rows = await query.orderBy('fs.date').orderBy('s.order').orderBy('c.angle').limit(filter.limit).execute();
  return rows.map((r) => ({ clipId: r.id, sessionId: r.session_id, sessionTitle: r.title, sessionDate: r.date, snapOrder: r.order, angle: r.angle, posterUrl: mediaUrl(r.id, 'poster') }));
}

export async function createCutup(app: AppContext, userId: number, input: { teamId: number; title: string; description?: string; filter?: CutupFilter; clipIds?: number[] }) {
  const clipIds = input.filter ? (await clipsForFilter(app, input.teamId, input.filter)).map((c) => c.clipId) : [...new Set(input.clipIds ?? [])];
  if (!input.filter && clipIds.length > 0) {
    const found = await app.db.selectFrom('clips').select('id').where('team_id', '=', input.teamId).where('id', 'in', clipIds).execute();
    if (found.length !== clipIds.length) throw validationFailed('Some clips are not this team\'s.', { clipIds: 'Not this team\'s clips.' });
  }
  const id = await app.db.transaction().execute(async (trx) => {
    const row = await trx
      .insertInto('cutups')
      .values({ team_id: input.teamId, title: input.title, description: input.description ?? null, filter: input.filter ? JSON.stringify(input.filter) : null, created_by: userId })
      .returning('id')
      .executeTakeFirstOrThrow();
    if (clipIds.length > 0) await trx.insertInto('cutup_items').values(clipIds.map((clip_id, i) => ({ cutup_id: row.id, position: i + 1, clip_id }))).execute();
    return row.id;
  });
  return getCutup(app, id);
}

/** Replaces the items (order and notes), title or description. */
export async function updateCutup(app: AppContext, cutupId: number, change: { title?: string; description?: string | null; items?: { clipId: number; note?: string | null }[] }) {
  const cutup = await app.db.selectFrom('cutups').select('team_id').where('id', '=', cutupId).executeTakeFirst();
  if (!cutup) throw notFound('That cut-up');
  if (change.items?.length) {
    const ids = [...new Set(change.items.map((i) => i.clipId))];
    const found = await app.db.selectFrom('clips').select('id').where('team_id', '=', cutup.team_id).where('id', 'in', ids).execute();
    if (found.length !== ids.length) throw validationFailed('Some clips are not this team\'s.', { items: 'Not this team\'s clips.' });
  }
  await app.db.transaction().execute(async (trx) => {
    const values = { ...(change.title !== undefined ? { title: change.title } : {}), ...(change.description !== undefined ? { description: change.description } : {}) };
    await trx.updateTable('cutups').set({ ...values, updated_at: app.now() }).where('id', '=', cutupId).execute();
    if (change.items) {
      await trx.deleteFrom('cutup_items').where('cutup_id', '=', cutupId).execute();
      if (change.items.length > 0) await trx.insertInto('cutup_items').values(change.items.map((item, i) => ({ cutup_id: cutupId, position: i + 1, clip_id: item.clipId, note: item.note ?? null }))).execute();
    }
  });
  return getCutup(app, cutupId);
}

export async function shareCutup(app: AppContext, cutupId: number, share: { playerIds: number[]; groups: PositionGroup[] }) {
  const cutup = await app.db.selectFrom('cutups').select('team_id').where('id', '=', cutupId).executeTakeFirst();
  if (!cutup) throw notFound('That cut-up');
  if (share.playerIds.length > 0) {
    const found = await app.db.selectFrom('players').select('id').where('team_id', '=', cutup.team_id).where('id', 'in', share.playerIds).execute();
    if (found.length !== new Set(share.playerIds).size) throw validationFailed('Some players are not on this team.', { playerIds: 'Not on this team.' });
  }
  await app.db.transaction().execute(async (trx) => {
    await trx.deleteFrom('cutup_shares').where('cutup_id', '=', cutupId).execute();
    const rows = [
      ...[...new Set(share.playerIds)].map((player_id) => ({ cutup_id: cutupId, player_id, position_group: null })),
      ...[...new Set(share.groups)].map((position_group) => ({ cutup_id: cutupId, player_id: null, position_group })),
    ];
    if (rows.length > 0) await trx.insertInto('cutup_shares').values(rows).execute();
  });
  return getCutup(app, cutupId);
}

export async function getCutup(app: AppContext, cutupId: number) {
  const cutup = await app.db.selectFrom('cutups').selectAll().where('id', '=', cutupId).executeTakeFirst();
  if (!cutup) throw notFound('That cut-up');
  const [items, shares] = await Promise.all([
    app.db
      .selectFrom('cutup_items as i')
      .innerJoin('clips as c', 'c.id', 'i.clip_id')
      .innerJoin('film_sessions as fs', 'fs.id', 'c.session_id')
      .leftJoin('snaps as s', 's.id', 'c.snap_id')
      .select(['i.position', 'i.clip_id', 'i.note', 'c.angle', 'c.status', 'c.rendition_key', 'c.poster_key', 'fs.title', 's.order'])
      .where('i.cutup_id', '=', cutupId)
      .orderBy('i.position')
      .execute(),
    app.db.selectFrom('cutup_shares').select(['player_id', 'position_group']).where('cutup_id', '=', cutupId).execute(),
  ]);
  return {
    id: cutup.id,
    teamId: cutup.team_id,
    title: cutup.title,
    description: cutup.description,
    filter: cutup.filter,
    items: items.map((i) => ({
      position: i.position,
      clipId: i.clip_id,
      note: i.note,
      angle: i.angle,
      sessionTitle: i.title,
      snapOrder: i.order,
      posterUrl: i.poster_key ? mediaUrl(i.clip_id, 'poster') : null,
      playbackUrl: i.status === 'ready' && i.rendition_key ? mediaUrl(i.clip_id, 'playback') : null,
    })),
    sharedWith: { playerIds: shares.flatMap((s) => (s.player_id ? [s.player_id] : [])), groups: shares.flatMap((s) => (s.position_group ? [s.position_group] : [])) },
  };
}

/** Staff see the team's cut-ups; a player only those shared with him (by name or group). */
export async function listCutups(app: AppContext, membership: TeamMembership) {
  let query = app.db.selectFrom('cutups').select(['id', 'title', 'description', 'updated_at']).where('team_id', '=', membership.teamId);
  if (membership.role === 'player') {
    const playerId = membership.playerId ?? -1;
    query = query.where(({ exists, selectFrom }) =>
      exists(
        selectFrom('cutup_items as i')
          .select('i.clip_id')
          .whereRef('i.cutup_id', '=', 'cutups.id')
          .where('i.clip_id', 'in', sql<number>`(SELECT clip_id FROM (${visibleClipIds(app.db, playerId)}) v)`)
          .where(({ exists: ex, selectFrom: sf }) => ex(sf('cutup_shares as sh').select('sh.id').whereRef('sh.cutup_id', '=', 'cutups.id'))),
      ),
    );
  }
  const rows = await query.orderBy('updated_at', 'desc').execute();
  return { cutups: rows.map((r) => ({ id: r.id, title: r.title, description: r.description, updatedAt: r.updated_at.toISOString() })) };
}

/** A player may open a cut-up only when it is shared with him. */
export async function assertCutupVisible(app: AppContext, membership: TeamMembership, cutupId: number): Promise<void> {
  if (membership.role !== 'player') return;
  const visible = (await listCutups(app, membership)).cutups.some((c) => c.id === cutupId);
  if (!visible) throw notFound('That cut-up');
}

export async function teamOfCutup(app: AppContext, params: { id: number }): Promise<number | null> {
  return (await app.db.selectFrom('cutups').select('team_id').where('id', '=', params.id).executeTakeFirst())?.team_id ?? null;
}
