import type { TagListItem } from '@shared/api/film';
import { DEFAULT_TAG_LISTS, TAG_LIST_KINDS, type TagListKind } from '@shared/film';
import type { Database } from '../../db/database';
import type { AppContext } from '../core/context';
import { conflict, notFound } from '../core/errors';
import { isUniqueViolation } from '../core/pg-errors';

/** Gives a team the default formation, concept, front and outcome lists the first time it needs them. */
export async function ensureDefaultTagLists(db: Database, teamId: number): Promise<void> {
  const any = await db.selectFrom('tag_list_items').select('id').where('team_id', '=', teamId).limit(1).executeTakeFirst();
  if (any) return;
  const rows = TAG_LIST_KINDS.flatMap((kind) => DEFAULT_TAG_LISTS[kind].map((name, i) => ({ team_id: teamId, kind, name, sort_order: i })));
  await db.insertInto('tag_list_items').values(rows).onConflict((oc) => oc.doNothing()).execute();
}

export async function listTagLists(app: AppContext, teamId: number): Promise<TagListItem[]> {
  await ensureDefaultTagLists(app.db, teamId);
  const rows = await app.db
    .selectFrom('tag_list_items')
    .select(['id', 'kind', 'name', 'active'])
    .where('team_id', '=', teamId)
    .orderBy('kind')
    .orderBy('sort_order')
    .orderBy('name')
    .execute();
  return rows.map((r) => ({ ...r, kind: r.kind as TagListKind }));
}

export async function addTagListItem(app: AppContext, teamId: number, kind: TagListKind, name: string): Promise<TagListItem> {
  await ensureDefaultTagLists(app.db, teamId);
  try {
    const row = await app.db
      .insertInto('tag_list_items')
      .values((eb) => ({
        team_id: teamId,
        kind,
        name,
        sort_order: eb.selectFrom('tag_list_items').select(eb.fn.coalesce(eb.fn.max('sort_order'), eb.lit(0)).as('m')).where('team_id', '=', teamId).where('kind', '=', kind),
      }))
      .returning(['id', 'kind', 'name', 'active'])
      .executeTakeFirstOrThrow();
    return { ...row, kind: row.kind as TagListKind };
  } catch (error) {
    if (isUniqueViolation(error)) throw conflict(`"${name}" is already on the ${kind} list.`, { name: 'Already on the list.' });
    throw error;
  }
}

/** Retired items stay on old snaps (reports keep their names) but are no longer offered. */
export async function setTagListItemActive(app: AppContext, teamId: number, itemId: number, active: boolean): Promise<TagListItem> {
  const row = await app.db
    .updateTable('tag_list_items')
    .set({ active })
    .where('id', '=', itemId)
    .where('team_id', '=', teamId)
    .returning(['id', 'kind', 'name', 'active'])
    .executeTakeFirst();
  if (!row) throw notFound('That list item');
  return { ...row, kind: row.kind as TagListKind };
}
