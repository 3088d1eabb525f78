import type { AppContext } from '../core/context';
import { notFound, validationFailed } from '../core/errors';

export async function listGoals(app: AppContext, playerId: number) {
  const rows = await app.db
    .selectFrom('player_goals as g')
    .leftJoin('users as u', 'u.id', 'g.set_by')
    .select(['g.id', 'g.component', 'g.target', 'g.due_on', 'g.note', 'g.achieved_at', 'g.created_at', 'u.name'])
    .where('g.player_id', '=', playerId)
    .orderBy('g.created_at', 'desc')
    .execute();
  return rows.map((r) => ({ id: r.id, component: r.component, target: Number(r.target), dueOn: r.due_on, note: r.note, achievedAt: r.achieved_at?.toISOString() ?? null, setBy: r.name, createdAt: r.created_at.toISOString() }));
}

/** The column is numeric(4,3) with CHECK (target > 0): a tiny positive target would round to 0.000 and break it. */
function storableTarget(target: number): number {
  if (target < 0.0005) throw validationFailed('A target rate must be at least 0.001 (0.1 %).', { target: 'Use at least 0.001.' });
  return target;
}

export async function addGoal(app: AppContext, userId: number, playerId: number, input: { component: string; target: number; dueOn?: string; note?: string }) {
  await app.db.insertInto('player_goals').values({ player_id: playerId, component: input.component, target: storableTarget(input.target), due_on: input.dueOn ?? null, note: input.note ?? null, set_by: userId }).execute();
  return { goals: await listGoals(app, playerId) };
}

export async function updateGoal(app: AppContext, playerId: number, goalId: number, change: { achieved?: boolean; target?: number; dueOn?: string | null; note?: string | null }) {
  const goal = await app.db.selectFrom('player_goals').select('id').where('id', '=', goalId).where('player_id', '=', playerId).executeTakeFirst();
  if (!goal) throw notFound('That goal');
  const values = {
    ...(change.achieved !== undefined ? { achieved_at: change.achieved ? app.now() : null } : {}),
    ...(change.target !== undefined ? { target: storableTarget(change.target) } : {}),
    ...(change.dueOn !== undefined ? { due_on: change.dueOn } : {}),
    ...(change.note !== undefined ? { note: change.note } : {}),
  };
  if (Object.keys(values).length > 0) await app.db.updateTable('player_goals').set(values).where('id', '=', goalId).execute();
  return { goals: await listGoals(app, playerId) };
}

export async function listNotes(app: AppContext, playerId: number) {
  const rows = await app.db
    .selectFrom('player_notes as n')
    .innerJoin('users as u', 'u.id', 'n.author_id')
    .select(['n.id', 'n.body', 'n.created_at', 'u.name'])
    .where('n.player_id', '=', playerId)
    .orderBy('n.created_at', 'desc')
    .limit(100)
    .execute();
  return rows.map((r) => ({ id: r.id, body: r.body, author: r.name, createdAt: r.created_at.toISOString() }));
}

export async function addNote(app: AppContext, userId: number, playerId: number, body: string) {
  await app.db.insertInto('player_notes').values({ player_id: playerId, author_id: userId, body }).execute();
  return { notes: await listNotes(app, playerId) };
}
