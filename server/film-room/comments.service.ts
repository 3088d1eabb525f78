import type { Comment } from '@shared/api/film-room';
import type { CommentKind } from '@shared/film-room';
import { isStaff } from '@shared/roles';
import type { AppContext } from '../core/context';
import { forbidden, notFound, validationFailed } from '../core/errors';
import type { SessionUser, TeamMembership } from '../core/route';
import { queueDigest } from './digest.service';
import { assertClipVisible } from './visibility';

async function clipOf(app: AppContext, clipId: number) {
  const clip = await app.db.selectFrom('clips').select(['id', 'team_id', 'duration_ms']).where('id', '=', clipId).executeTakeFirst();
  if (!clip) throw notFound('That clip');
  return clip;
}

/** A coaching point for one or more players at a moment (or span) of a clip. Staff only. */
export async function createPoint(
  app: AppContext,
  author: SessionUser,
  clipId: number,
  input: { playerIds: number[]; atMs: number; endMs?: number; kind: CommentKind; component?: string; body: string },
): Promise<Comment> {
  const clip = await clipOf(app, clipId);
  if (clip.duration_ms !== null && input.atMs > clip.duration_ms) throw validationFailed('The moment lies after the end of the clip.', { atMs: 'After the end of the clip.' });
  const ids = [...new Set(input.playerIds)];
  const players = await app.db.selectFrom('players').select('id').where('team_id', '=', clip.team_id).where('id', 'in', ids).execute();
  if (players.length !== ids.length) throw validationFailed('Some players are not on this team.', { playerIds: 'Not on this team.' });
  const id = await app.db.transaction().execute(async (trx) => {
    const row = await trx
      .insertInto('clip_comments')
      .values({ team_id: clip.team_id, clip_id: clipId, author_id: author.id, at_ms: input.atMs, end_ms: input.endMs ?? null, kind: input.kind, component: input.component ?? null, body: input.body })
      .returning('id')
      .executeTakeFirstOrThrow();
    await trx.insertInto('comment_targets').values(ids.map((player_id) => ({ comment_id: row.id, player_id }))).execute();
    for (const playerId of ids) await queueDigest(app, playerId, trx);
    return row.id;
  });
  return getComment(app, id);
}

/** A player's question on a clip he can see; the staff answer in its thread. */
export async function createQuestion(app: AppContext, author: SessionUser, membership: TeamMembership, clipId: number, input: { atMs: number; body: string }): Promise<Comment> {
  const clip = await clipOf(app, clipId);
  await assertClipVisible(app, membership, clipId);
  const row = await app.db.transaction().execute(async (trx) => {
    const inserted = await trx
      .insertInto('clip_comments')
      .values({ team_id: clip.team_id, clip_id: clipId, author_id: author.id, at_ms: input.atMs, kind: 'question', body: input.body })
      .returning('id')
      .executeTakeFirstOrThrow();
    // The asking player is the question's own target, so it shows in his queue with its answers.
    if (membership.playerId !== null) await trx.insertInto('comment_targets').values({ comment_id: inserted.id, player_id: membership.playerId, acknowledged_at: new Date() }).execute();
    return inserted;
  });
  return getComment(app, row.id);
}

async function rootOf(app: AppContext, commentId: number) {
  const comment = await app.db.selectFrom('clip_comments').select(['id', 'clip_id', 'parent_id', 'author_id', 'team_id', 'at_ms']).where('id', '=', commentId).executeTakeFirst();
  if (!comment) throw notFound('That comment');
  if (comment.parent_id === null) return comment;
  return (await app.db.selectFrom('clip_comments').select(['id', 'clip_id', 'parent_id', 'author_id', 'team_id', 'at_ms']).where('id', '=', comment.parent_id).executeTakeFirstOrThrow());
}

/** Whether a player takes part in a thread: it is for him, or he asked it. */
async function playerInThread(app: AppContext, rootId: number, playerId: number | null, userId: number): Promise<boolean> {
  if (playerId === null) return false;
  const target = await app.db.selectFrom('comment_targets').select('player_id').where('comment_id', '=', rootId).where('player_id', '=', playerId).executeTakeFirst();
  const root = await app.db.selectFrom('clip_comments').select('author_id').where('id', '=', rootId).executeTakeFirstOrThrow();
  return Boolean(target) || root.author_id === userId;
}

export async function createReply(app: AppContext, author: SessionUser, membership: TeamMembership, commentId: number, body: string): Promise<Comment> {
  const root = await rootOf(app, commentId);
  if (root.team_id !== membership.teamId) throw notFound('That comment');
  if (!isStaff(membership.role) && !(await playerInThread(app, root.id, membership.playerId, author.id))) throw notFound('That comment');
  const row = await app.db
    .insertInto('clip_comments')
    .values({ team_id: root.team_id, clip_id: root.clip_id, parent_id: root.id, author_id: author.id, at_ms: root.at_ms, kind: 'reply', body })
    .returning('id')
    .executeTakeFirstOrThrow();
  return getComment(app, row.id);
}

/** Edits keep the earlier text as a revision. Only the author edits. */
export async function editComment(app: AppContext, user: SessionUser, commentId: number, body: string): Promise<Comment> {
  const comment = await app.db.selectFrom('clip_comments').select(['author_id', 'body', 'hidden_at']).where('id', '=', commentId).executeTakeFirst();
  if (!comment) throw notFound('That comment');
  if (comment.author_id !== user.id) throw forbidden('Only the author can edit a comment.');
  if (comment.hidden_at) throw validationFailed('A removed comment cannot be edited.');
  await app.db.transaction().execute(async (trx) => {
    await trx.insertInto('comment_revisions').values({ comment_id: commentId, body: comment.body, edited_by: user.id }).execute();
    await trx.updateTable('clip_comments').set({ body, updated_at: app.now() }).where('id', '=', commentId).execute();
  });
  return getComment(app, commentId);
}

/** Deleting hides a comment: the thread and its replies stay; the text shows as removed. */
export async function hideComment(app: AppContext, user: SessionUser, membership: TeamMembership, commentId: number): Promise<void> {
  const comment = await app.db.selectFrom('clip_comments').select(['author_id', 'team_id']).where('id', '=', commentId).executeTakeFirst();
  if (!comment || comment.team_id !== membership.teamId) throw notFound('That comment');
  const lead = membership.role === 'admin' || membership.role === 'coordinator';
  if (comment.author_id !== user.id && !lead) throw forbidden('Only the author or the coordinator can remove a comment.');
  await app.db.updateTable('clip_comments').set({ hidden_at: app.now(), hidden_by: user.id }).where('id', '=', commentId).where('hidden_at', 'is', null).execute();
}

export async function acknowledge(app: AppContext, membership: TeamMembership, commentId: number): Promise<void> {
  if (membership.playerId === null) throw forbidden('Only the player a point is for can acknowledge it.');
  const result = await app.db
    .updateTable('comment_targets')
    .set({ acknowledged_at: app.now() })
    .where('comment_id', '=', commentId)
    .where('player_id', '=', membership.playerId)
    .executeTakeFirst();
  if (Number(result.numUpdatedRows) === 0) throw notFound('That coaching point');
}

interface Viewer {
  userId: number;
  membership: TeamMembership;
}

/** The threads on a clip as the viewer may see them: staff all; a player those for him or his own. */
export async function listClipComments(app: AppContext, viewer: Viewer, clipId: number): Promise<Comment[]> {
  await assertClipVisible(app, viewer.membership, clipId);
  const rows = await commentRows(app).where('c.clip_id', '=', clipId).orderBy('c.at_ms').orderBy('c.created_at').execute();
  const targets = await targetRows(app, rows.map((r) => r.id));
  const all = rows.map((r) => toComment(r, targets));
  let roots = all.filter((c) => c.parentId === null);
  if (viewer.membership.role === 'player') {
    roots = roots.filter((c) => c.targets.some((t) => t.playerId === viewer.membership.playerId) || c.author.id === viewer.userId);
  }
  return roots.map((root) => ({ ...root, replies: all.filter((c) => c.parentId === root.id) }));
}

export async function getComment(app: AppContext, id: number): Promise<Comment> {
  const row = await commentRows(app).where('c.id', '=', id).executeTakeFirst();
  if (!row) throw notFound('That comment');
  return toComment(row, await targetRows(app, [id]));
}

export async function teamOfComment(app: AppContext, params: { id: number }): Promise<number | null> {
  return (await app.db.selectFrom('clip_comments').select('team_id').where('id', '=', params.id).executeTakeFirst())?.team_id ?? null;
}

function commentRows(app: AppContext) {
  return app.db
    .selectFrom('clip_comments as c')
    .innerJoin('users as u', 'u.id', 'c.author_id')
    .leftJoin('memberships as m', (j) => j.onRef('m.user_id', '=', 'c.author_id').onRef('m.team_id', '=', 'c.team_id'))
    .select((eb) => [
      'c.id',
      'c.clip_id',
      'c.parent_id',
      'c.at_ms',
      'c.end_ms',
      'c.kind',
      'c.component',
      'c.body',
      'c.hidden_at',
      'c.created_at',
      'u.id as author_id',
      'u.name as author_name',
      'm.role as author_role',
      eb.exists(eb.selectFrom('comment_revisions').select('id').whereRef('comment_revisions.comment_id', '=', 'c.id')).as('edited'),
    ]);
}

function targetRows(app: AppContext, ids: number[]) {
  if (ids.length === 0) return Promise.resolve([]);
  return app.db
    .selectFrom('comment_targets as t')
    .innerJoin('players as p', 'p.id', 't.player_id')
    .select(['t.comment_id', 't.player_id', 'p.name', 't.acknowledged_at'])
    .where('t.comment_id', 'in', ids)
    .execute();
}

type CommentRow = Awaited<ReturnType<ReturnType<typeof commentRows>['execute']>>[number];

function toComment(r: CommentRow, targets: Awaited<ReturnType<typeof targetRows>>): Comment {
  const hidden = r.hidden_at !== null;
  return {
    id: r.id,
    clipId: r.clip_id,
    parentId: r.parent_id,
    atMs: r.at_ms,
    endMs: r.end_ms,
    kind: r.kind as CommentKind,
    component: r.component,
    body: hidden ? '(removed)' : r.body,
    hidden,
    edited: Boolean(r.edited),
    author: { id: r.author_id, name: r.author_name, isStaff: r.author_role !== null && r.author_role !== 'player' },
    createdAt: r.created_at.toISOString(),
    targets: targets.filter((t) => t.comment_id === r.id).map((t) => ({ playerId: t.player_id, name: t.name, acknowledged: t.acknowledged_at !== null })),
  };
}
