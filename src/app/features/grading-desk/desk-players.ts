import type { Desk } from '@shared/api/grading';
import { POSITIONS } from '@shared/roster';
import type { GridPlayer } from './grade-grid';

export type DeskSnap = Desk['snaps'][number];

/** The linemen of one snap, left to right (LT … RT, then TE), with the other coaches who graded each. */
export function gridPlayers(snap: DeskSnap, roster: Desk['players']): GridPlayer[] {
  const byId = new Map(roster.map((p) => [p.playerId, p]));
  return snap.participants
    .map((p) => {
      const player = byId.get(p.playerId);
      return {
        playerId: p.playerId,
        name: player?.name ?? `Player ${p.playerId}`,
        jersey: player?.jersey ?? null,
        position: p.position,
        alsoGradedBy: snap.otherGraders.filter((g) => g.playerIds.includes(p.playerId)).map((g) => g.name),
      };
    })
    .sort((a, b) => POSITIONS.indexOf(a.position) - POSITIONS.indexOf(b.position) || (a.jersey ?? 0) - (b.jersey ?? 0));
}
