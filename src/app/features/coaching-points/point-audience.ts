import type { Desk } from '@shared/api/grading';
import type { Player } from '@shared/api/roster';
import type { PointPlayer } from './point-form';

const LINE_ORDER: readonly string[] = ['LT', 'LG', 'C', 'RG', 'RT', 'TE'];
const byJersey = (a: PointPlayer, b: PointPlayer) => (a.jersey ?? 1000) - (b.jersey ?? 1000) || a.name.localeCompare(b.name);

/**
 * Who a point on this snap is likely for: the desk's participants of the snap (the linemen the
 * coach graded there), then everyone else. Without the desk, the active roster, nobody picked.
 */
export function pointAudience(desk: Desk | null, snapId: number | null, roster: readonly Player[]): { onSnap: PointPlayer[]; others: PointPlayer[] } {
  if (desk) {
    const everyone = desk.players.map((p) => ({ playerId: p.playerId, name: p.name, jersey: p.jersey }));
    // Left to right along the line, as the coach sees them on the film.
    const participants = [...(desk.snaps.find((s) => s.snapId === snapId)?.participants ?? [])].sort((a, b) => LINE_ORDER.indexOf(a.position) - LINE_ORDER.indexOf(b.position));
    const ids = participants.map((p) => p.playerId);
    const onSnap = ids.flatMap((id) => everyone.filter((p) => p.playerId === id));
    return { onSnap, others: everyone.filter((p) => !ids.includes(p.playerId)).sort(byJersey) };
  }
  const others = roster.filter((p) => p.status !== 'inactive').map((p) => ({ playerId: p.id, name: p.name, jersey: p.jersey }));
  return { onSnap: [], others: others.sort(byJersey) };
}
