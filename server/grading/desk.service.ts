import type { Desk } from '@shared/api/grading';
import type { Position } from '@shared/roster';
import type { Database } from '../../db/database';
import type { AppContext } from '../core/context';
import { notFound, validationFailed } from '../core/errors';
import { lockedError, toGrade } from './grades.service';
import { findSnapContext, gradesQuery } from './grades.repository';
import { startersOf } from './depth-chart.service';
import { getScheme } from './scheme.service';

/**
 * Who blocked on each snap: the snap's own list where one was recorded, else the starters of the
 * depth chart in force at the session's week (a session without a week: the current chart), so
 * regrading an old game shows who started that week, not today's starters.
 */
export async function participantsBySnap(db: Database, sessionId: number, seasonId: number, week: number | null) {
  const [snaps, listed, starters] = await Promise.all([
    db.selectFrom('snaps').select(['id', 'order']).where('session_id', '=', sessionId).orderBy('order').execute(),
    db
      .selectFrom('snap_participants')
      .innerJoin('snaps', 'snaps.id', 'snap_participants.snap_id')
      .select(['snap_participants.snap_id', 'snap_participants.player_id', 'snap_participants.position'])
      .where('snaps.session_id', '=', sessionId)
      .execute(),
    startersOf(db, seasonId, week),
  ]);
  return snaps.map((snap) => {
    const own = listed.filter((p) => p.snap_id === snap.id).map((p) => ({ playerId: p.player_id, position: p.position as Position }));
    return { snapId: snap.id, order: snap.order, participants: own.length > 0 ? own : starters, fromDepthChart: own.length === 0 };
  });
}

export async function loadDesk(app: AppContext, sessionId: number, graderId: number): Promise<Desk> {
  const session = await app.db.selectFrom('film_sessions').select(['id', 'team_id', 'season_id', 'week', 'grading_locked']).where('id', '=', sessionId).executeTakeFirst();
  if (!session) throw notFound('That film session');
  const [scheme, snaps, grades, players] = await Promise.all([
    getScheme(app, session.team_id),
    participantsBySnap(app.db, sessionId, session.season_id, session.week),
    gradesQuery(app.db).innerJoin('snaps', 'snaps.id', 'grades.snap_id').where('snaps.session_id', '=', sessionId).execute(),
    app.db
      .selectFrom('roster_entries as r')
      .innerJoin('players as p', 'p.id', 'r.player_id')
      .select(['p.id', 'p.name', 'r.jersey', 'r.positions'])
      .where('r.season_id', '=', session.season_id)
      .where('r.status', '<>', 'inactive')
      .orderBy('r.jersey')
      .execute(),
  ]);
  return {
    sessionId,
    teamId: session.team_id,
    scheme,
    locked: session.grading_locked,
    players: players.map((p) => ({ playerId: p.id, name: p.name, jersey: p.jersey, positions: p.positions })),
    snaps: snaps.map((snap) => {
      const onSnap = grades.filter((g) => g.snap_id === snap.snapId);
      const others = new Map<number, { graderId: number; name: string; playerIds: number[] }>();
      for (const g of onSnap.filter((g) => g.grader_id !== graderId)) {
        const entry = others.get(g.grader_id) ?? { graderId: g.grader_id, name: g.grader_name, playerIds: [] };
        entry.playerIds.push(g.player_id);
        others.set(g.grader_id, entry);
      }
      return {
        snapId: snap.snapId,
        order: snap.order,
        participants: snap.participants,
        participantsFromDepthChart: snap.fromDepthChart,
        myGrades: onSnap.filter((g) => g.grader_id === graderId).map(toGrade),
        otherGraders: [...others.values()],
      };
    }),
  };
}

/** Records who was on the field for one snap (substitutions, a sixth lineman, a tight end). */
export async function setParticipants(app: AppContext, snapId: number, participants: { playerId: number; position: Position }[]) {
  const snap = await findSnapContext(app.db, snapId);
  if (!snap) throw notFound('That snap');
  if (snap.grading_locked) await lockedError();
  const ids = participants.map((p) => p.playerId);
  if (ids.length > 0) {
    const found = await app.db.selectFrom('roster_entries').select('player_id').where('season_id', '=', snap.season_id).where('player_id', 'in', ids).execute();
    if (found.length !== ids.length) throw validationFailed("Some players are not on this season's roster.", { participants: 'Not on the roster.' });
  }
  await app.db.transaction().execute(async (trx) => {
    await trx.deleteFrom('snap_participants').where('snap_id', '=', snapId).execute();
    if (participants.length > 0) await trx.insertInto('snap_participants').values(participants.map((p) => ({ snap_id: snapId, player_id: p.playerId, position: p.position }))).execute();
  });
  return { participants };
}

export async function listSnapGrades(app: AppContext, snapId: number) {
  const rows = await gradesQuery(app.db).where('grades.snap_id', '=', snapId).orderBy('grades.player_id').orderBy('grades.grader_id').execute();
  return { grades: rows.map(toGrade) };
}
