import { formatClock } from '@shared/film';
import { COMMENT_KIND_LABELS, type CommentKind } from '@shared/film-room';
import { DIGEST_MIN_HOURS, getMailPreferences, unsubscribeLink } from '../server/film-room/digest.service';
import { coachingDigestMail } from '../server/mail/templates';
import type { JobHandler } from './handlers';

/**
 * Sends one player the coaching points he has not had by mail yet, in one message. Runs at most once
 * an hour per player (queue throttling, and the last digest's time checked here); a player who turned
 * digests off gets none, and his points are marked so they do not pile up for later.
 */
export const sendCoachingDigest: JobHandler<'digest.coaching'> = async (deps, { playerId }) => {
  const { db, config, logger, jobs } = deps;
  const account = await db
    .selectFrom('memberships')
    .innerJoin('users', 'users.id', 'memberships.user_id')
    .innerJoin('players', 'players.id', 'memberships.player_id')
    .select(['users.id as userId', 'users.email', 'players.name'])
    .where('memberships.player_id', '=', playerId)
    .where('memberships.active', '=', true)
    .where('users.active', '=', true)
    .executeTakeFirst();
  if (!account) return;
  const prefs = await getMailPreferences(deps, account.userId);
  const pending = await db
    .selectFrom('comment_targets as t')
    .innerJoin('clip_comments as c', 'c.id', 't.comment_id')
    .innerJoin('clips', 'clips.id', 'c.clip_id')
    .innerJoin('film_sessions as s', 's.id', 'clips.session_id')
    .leftJoin('snaps', 'snaps.id', 'clips.snap_id')
    .innerJoin('users as a', 'a.id', 'c.author_id')
    .select(['t.comment_id', 'c.clip_id', 'c.at_ms', 'c.kind', 'c.body', 'a.name as author', 's.title', 'snaps.order'])
    .where('t.player_id', '=', playerId)
    .where('t.digested_at', 'is', null)
    .where('t.acknowledged_at', 'is', null)
    .where('c.hidden_at', 'is', null)
    .where('c.author_id', '<>', account.userId)
    .orderBy('s.date')
    .orderBy('snaps.order')
    .orderBy('c.at_ms')
    .execute();
  if (pending.length === 0) return;
  const now = new Date();
  const ids = pending.map((p) => p.comment_id);
  if (!prefs.coachingDigest) {
    await db.updateTable('comment_targets').set({ digested_at: now }).where('player_id', '=', playerId).where('comment_id', 'in', ids).execute();
    return;
  }
  const state = await db.selectFrom('mail_preferences').select('last_digest_at').where('user_id', '=', account.userId).executeTakeFirst();
  const spacingMs = Math.max(DIGEST_MIN_HOURS, prefs.digestEveryHours) * 3600_000;
  const last = state?.last_digest_at?.getTime();
  if (last !== undefined && now.getTime() - last < spacingMs) {
    // Too soon after the last one: try again when the hour (or the chosen spacing) is up.
    await jobs.send('digest.coaching', { playerId }, undefined, { startAfterSeconds: Math.ceil((last + spacingMs - now.getTime()) / 1000), singletonKey: `digest-later:${playerId}`, singletonSeconds: 60 });
    return;
  }
  const message = coachingDigestMail({
    to: account.email,
    playerName: account.name,
    points: pending.map((p) => ({
      sessionTitle: p.title,
      snapOrder: p.order,
      at: formatClock(p.at_ms),
      kind: COMMENT_KIND_LABELS[p.kind as CommentKind] ?? p.kind,
      body: p.body,
      author: p.author,
      link: `${config.publicUrl}/study/clips/${p.clip_id}?at=${p.at_ms}`,
    })),
    queueLink: `${config.publicUrl}/study`,
    unsubscribeLink: unsubscribeLink(deps, account.userId, 'digest'),
  });
  await deps.mailer.send(message);
  await db.transaction().execute(async (trx) => {
    await trx.updateTable('comment_targets').set({ digested_at: now }).where('player_id', '=', playerId).where('comment_id', 'in', ids).execute();
    await trx
      .insertInto('mail_preferences')
      .values({ user_id: account.userId, last_digest_at: now, updated_at: now })
      .onConflict((oc) => oc.column('user_id').doUpdateSet({ last_digest_at: now }))
      .execute();
  });
  logger.info({ event: 'digest_sent', playerId, points: pending.length }, 'coaching digest sent');
};
