import { sql } from 'kysely';
import type { Database } from '../../db/database';
import type { AppContext } from '../core/context';
import { notFound } from '../core/errors';
import type { TeamMembership } from '../core/route';

/**
 * A player sees a clip only when a coaching point on it is for him, or a cut-up holding it is
 * shared with him (by name, or with a position group he is in this season). One query, used by
 * every route that answers a player with clip data or media.
 */
export function visibleClipIds(db: Database, playerId: number) {
  return sql<{ clip_id: number }>`
    SELECT c.clip_id FROM clip_comments c
    JOIN comment_targets t ON t.comment_id = c.id
    WHERE t.player_id = ${playerId} AND c.hidden_at IS NULL AND c.parent_id IS NULL
    UNION
    SELECT i.clip_id FROM cutup_items i
    JOIN cutup_shares s ON s.cutup_id = i.cutup_id
    WHERE s.player_id = ${playerId}
       OR (s.position_group IS NOT NULL AND EXISTS (
            SELECT 1 FROM roster_entries r JOIN seasons se ON se.id = r.season_id AND se.is_current
            WHERE r.player_id = ${playerId} AND r.status <> 'inactive'
              AND (CASE s.position_group WHEN 'OL' THEN r.positions && ARRAY['LT','LG','C','RG','RT'] ELSE s.position_group = ANY (r.positions) END)))`;
}

export async function playerCanSeeClip(db: Database, playerId: number, clipId: number): Promise<boolean> {
  const rows = await sql<{ ok: number }>`SELECT 1 AS ok FROM (${visibleClipIds(db, playerId)}) v WHERE v.clip_id = ${clipId} LIMIT 1`.execute(db);
  return rows.rows.length > 0;
}

/** Staff see every clip of their team; a player only what is tagged to or shared with him (404 otherwise). */
export async function assertClipVisible(app: AppContext, membership: TeamMembership, clipId: number): Promise<void> {
  if (membership.role !== 'player') return;
  if (membership.playerId === null || !(await playerCanSeeClip(app.db, membership.playerId, clipId))) {
    app.logger.warn({ event: 'authz_denied', reason: 'clip not shared with player', clipId, playerId: membership.playerId }, 'authorization denied');
    throw notFound('That clip');
  }
}
