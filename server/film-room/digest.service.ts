import { createHmac, timingSafeEqual } from 'node:crypto';
import type { Kysely } from 'kysely';
import type { MailPreferences } from '@shared/api/film-room';
import type { AppContext } from '../core/context';
import { tokenInvalid } from '../core/errors';

/** At most one coaching digest per player per hour; later points go in the next one. */
export const DIGEST_MIN_HOURS = 1;

export async function queueDigest(app: AppContext, playerId: number, trx?: Kysely<any>): Promise<void> {
  await app.jobs.send('digest.coaching', { playerId }, trx, {
    startAfterSeconds: app.config.digestDelaySeconds,
    singletonKey: `digest:${playerId}`,
    singletonSeconds: DIGEST_MIN_HOURS * 3600,
    singletonNextSlot: true,
  });
}

/**
 * Unsubscribe links carry an HMAC of the account and the list, so nothing secret is stored and a
 * link works for that account and list only. Invitation and reset mails are essential and have none.
 */
export type MailList = 'digest' | 'weekly';

export function unsubscribeToken(secret: string, userId: number, list: MailList): string {
  const mac = createHmac('sha256', secret).update(`unsubscribe:${userId}:${list}`).digest('base64url');
  return `${userId}.${list}.${mac}`;
}

export function readUnsubscribeToken(secret: string, token: string): { userId: number; list: MailList } {
  const [id, list, mac] = token.split('.');
  const userId = Number(id);
  if (!Number.isSafeInteger(userId) || (list !== 'digest' && list !== 'weekly') || !mac) throw tokenInvalid('This unsubscribe link is not valid.');
  const expected = Buffer.from(unsubscribeToken(secret, userId, list).split('.')[2]!);
  const given = Buffer.from(mac);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) throw tokenInvalid('This unsubscribe link is not valid.');
  return { userId, list };
}

export function unsubscribeLink(app: Pick<AppContext, 'config'>, userId: number, list: MailList): string {
  return `${app.config.publicUrl}/mail/unsubscribe?token=${encodeURIComponent(unsubscribeToken(app.config.sessionSecret, userId, list))}`;
}

const DEFAULTS: MailPreferences = { coachingDigest: true, digestEveryHours: 1, weeklySummary: true };

export async function getMailPreferences(app: Pick<AppContext, 'db'>, userId: number): Promise<MailPreferences> {
  const row = await app.db.selectFrom('mail_preferences').select(['coaching_digest', 'digest_every_hours', 'weekly_summary']).where('user_id', '=', userId).executeTakeFirst();
  if (!row) return DEFAULTS;
  return { coachingDigest: row.coaching_digest, digestEveryHours: row.digest_every_hours as 1 | 3 | 24, weeklySummary: row.weekly_summary };
}

export async function saveMailPreferences(app: AppContext, userId: number, prefs: MailPreferences): Promise<MailPreferences> {
  await app.db
    .insertInto('mail_preferences')
    .values({ user_id: userId, coaching_digest: prefs.coachingDigest, digest_every_hours: prefs.digestEveryHours, weekly_summary: prefs.weeklySummary, updated_at: app.now() })
    .onConflict((oc) => oc.column('user_id').doUpdateSet({ coaching_digest: prefs.coachingDigest, digest_every_hours: prefs.digestEveryHours, weekly_summary: prefs.weeklySummary, updated_at: app.now() }))
    .execute();
  return getMailPreferences(app, userId);
}

/** Turns off one list for the account the link names. */
export async function unsubscribe(app: AppContext, token: string): Promise<{ list: MailList }> {
  const { userId, list } = readUnsubscribeToken(app.config.sessionSecret, token);
  const current = await getMailPreferences(app, userId);
  await saveMailPreferences(app, userId, { ...current, ...(list === 'digest' ? { coachingDigest: false } : { weeklySummary: false }) });
  app.logger.info({ event: 'unsubscribed', userId, list }, 'unsubscribed');
  return { list };
}
