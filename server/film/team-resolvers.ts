import type { Request } from 'express';
import type { AppContext } from '../core/context';
import { validationFailed } from '../core/errors';
import { findClipTeam, findSessionTeam, findSnapTeam } from './film.repository';

/** Which team a film object belongs to: the authorization check runs against that team. */
export const teamOfSession = async (app: AppContext, params: { id: number }) => (await findSessionTeam(app.db, params.id))?.team_id ?? null;
export const teamOfClip = async (app: AppContext, params: { id: number }) => (await findClipTeam(app.db, params.id))?.team_id ?? null;
export const teamOfSnap = async (app: AppContext, params: { id: number }) => (await findSnapTeam(app.db, params.id))?.team_id ?? null;

function positiveId(value: unknown): number | null {
  const n = typeof value === 'number' ? value : typeof value === 'string' && /^\d+$/.test(value) ? Number(value) : NaN;
  return Number.isSafeInteger(n) && n > 0 ? n : null;
}

/** For routes that name the team in the body (`teamId`) or the query. */
export const teamInBody = async (_app: AppContext, _params: unknown, req: Request) => {
  const id = positiveId((req.body as { teamId?: unknown } | undefined)?.teamId);
  if (id === null) throw validationFailed('Say which team this is for.', { teamId: 'Required.' });
  return id;
};
export const teamInQuery = async (_app: AppContext, _params: unknown, req: Request) => {
  const id = positiveId(req.query.teamId);
  if (id === null) throw validationFailed('Say which team this is for.', { teamId: 'Required.' });
  return id;
};
