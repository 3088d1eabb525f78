import { sql } from 'kysely';
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import { defuseCell, restoreCell } from '@shared/csv-cells';
import { snapTagsSchema, type Snap, type SnapTags, type SnapTagsUpdate } from '@shared/api/film';
import type { Angle, ClipState, Direction, FieldSide, Hash, TagListKind } from '@shared/film';
import type { Database } from '../../db/database';
import type { AppContext } from '../core/context';
import { notFound, validationFailed } from '../core/errors';
import { fieldErrors } from '../core/validation';
import { listSnapClips, listSnaps, type SnapRow } from './film.repository';
import { mediaUrl } from './media-urls';
import { ensureDefaultTagLists } from './tag-lists.service';

const TAG_ID_FIELDS: Record<'formationId' | 'conceptId' | 'frontId' | 'outcomeId', TagListKind> = {
  formationId: 'formation',
  conceptId: 'concept',
  frontId: 'front',
  outcomeId: 'outcome',
};

function toSnap(row: SnapRow, clips: Awaited<ReturnType<typeof listSnapClips>>): Snap {
  return {
    id: row.id,
    sessionId: row.session_id,
    order: row.order,
    quarter: row.quarter,
    down: row.down,
    distance: row.distance,
    yardLine: row.yard_line,
    fieldSide: row.field_side as FieldSide | null,
    hash: row.hash as Hash | null,
    personnel: row.personnel,
    formationId: row.formation_id,
    conceptId: row.concept_id,
    direction: row.direction as Direction | null,
    frontId: row.front_id,
    resultYards: row.result_yards,
    outcomeId: row.outcome_id,
    period: row.period,
    notes: row.notes,
    clips: clips
      .filter((c) => c.snap_id === row.id)
      .map((c) => ({ id: c.id, angle: c.angle as Angle, status: c.status as ClipState, posterUrl: c.poster_key ? mediaUrl(c.id, 'poster') : null })),
  };
}

export async function listSessionSnaps(app: AppContext, sessionId: number): Promise<Snap[]> {
  const [snaps, clips] = await Promise.all([listSnaps(app.db, sessionId), listSnapClips(app.db, sessionId)]);
  return snaps.map((s) => toSnap(s, clips));
}

async function getSnap(app: AppContext, snapId: number): Promise<Snap> {
  const row = await app.db.selectFrom('snaps').selectAll().where('id', '=', snapId).executeTakeFirst();
  if (!row) throw notFound('That snap');
  const clips = (await listSnapClips(app.db, row.session_id)).filter((c) => c.snap_id === snapId);
  return toSnap(row, clips);
}

function columnsOf(tags: SnapTagsUpdate) {
  const map: Record<keyof SnapTags, string> = {
    quarter: 'quarter', down: 'down', distance: 'distance', yardLine: 'yard_line', fieldSide: 'field_side', hash: 'hash',
    personnel: 'personnel', formationId: 'formation_id', conceptId: 'concept_id', direction: 'direction', frontId: 'front_id',
    resultYards: 'result_yards', outcomeId: 'outcome_id', period: 'period', notes: 'notes',
  };
  return Object.fromEntries(Object.entries(tags).filter(([, v]) => v !== undefined).map(([k, v]) => [map[k as keyof SnapTags], v]));
}

/** Tag ids must name an item of the right list of the same team. */
async function assertTagIds(db: Database, teamId: number, tags: SnapTagsUpdate): Promise<void> {
  const wanted = Object.entries(TAG_ID_FIELDS).filter(([field]) => typeof tags[field as keyof SnapTagsUpdate] === 'number');
  if (wanted.length === 0) return;
  const ids = wanted.map(([field]) => tags[field as keyof SnapTagsUpdate] as number);
  const rows = await db.selectFrom('tag_list_items').select(['id', 'kind']).where('team_id', '=', teamId).where('id', 'in', ids).execute();
  const fields: Record<string, string> = {};
  for (const [field, kind] of wanted) {
    const id = tags[field as keyof SnapTagsUpdate];
    if (!rows.some((r) => r.id === id && r.kind === kind)) fields[field] = `Choose a ${kind} from the team's list.`;
  }
  if (Object.keys(fields).length > 0) throw validationFailed('Some tags are not on the team lists.', fields);
}

export async function updateSnapTags(app: AppContext, teamId: number, snapId: number, tags: SnapTagsUpdate): Promise<Snap> {
  await assertTagIds(app.db, teamId, tags);
  const values = columnsOf(tags);
  if (Object.keys(values).length > 0) {
    await app.db.updateTable('snaps').set({ ...values, updated_at: app.now() }).where('id', '=', snapId).execute();
  }
  return getSnap(app, snapId);
}

/** Applies the same tags to several snaps of one session at once. */
export async function bulkUpdateSnapTags(app: AppContext, teamId: number, sessionId: number, snapIds: number[], tags: SnapTagsUpdate): Promise<Snap[]> {
  await assertTagIds(app.db, teamId, tags);
  const values = columnsOf(tags);
  const found = await app.db.selectFrom('snaps').select('id').where('session_id', '=', sessionId).where('id', 'in', snapIds).execute();
  if (found.length !== new Set(snapIds).size) throw validationFailed('Some snaps are not in this session.', { snapIds: 'Not in this session.' });
  if (Object.keys(values).length > 0) {
    await app.db.updateTable('snaps').set({ ...values, updated_at: app.now() }).where('id', 'in', snapIds).execute();
  }
  return listSessionSnaps(app, sessionId);
}

export async function createSnap(app: AppContext, sessionId: number, order?: number): Promise<Snap> {
  const id = await app.db.transaction().execute(async (trx) => {
    await trx.selectFrom('film_sessions').select('id').where('id', '=', sessionId).forUpdate().execute();
    const max = await trx.selectFrom('snaps').select((eb) => eb.fn.max('order').as('m')).where('session_id', '=', sessionId).executeTakeFirst();
    const last = Number(max?.m ?? 0);
    const at = order === undefined || order > last ? last + 1 : order;
    if (at <= last) {
      // Make room: later snaps move down by one (the unique order is checked at commit).
      await sql`SET CONSTRAINTS snaps_session_order_unique DEFERRED`.execute(trx);
      await trx.updateTable('snaps').set((eb) => ({ order: eb('order', '+', 1) })).where('session_id', '=', sessionId).where('order', '>=', at).execute();
    }
    return (await trx.insertInto('snaps').values({ session_id: sessionId, order: at }).returning('id').executeTakeFirstOrThrow()).id;
  });
  return getSnap(app, id);
}

/** Deletes a snap; its clips stay in the session, unplaced. Later snaps move up. */
export async function deleteSnap(app: AppContext, snapId: number): Promise<void> {
  await app.db.transaction().execute(async (trx) => {
    const row = await trx.selectFrom('snaps').select(['session_id', 'order']).where('id', '=', snapId).executeTakeFirst();
    if (!row) throw notFound('That snap');
    await trx.deleteFrom('snaps').where('id', '=', snapId).execute();
    await sql`SET CONSTRAINTS snaps_session_order_unique DEFERRED`.execute(trx);
    await trx.updateTable('snaps').set((eb) => ({ order: eb('order', '-', 1) })).where('session_id', '=', row.session_id).where('order', '>', row.order).execute();
  });
}

/** Attaches a clip to a snap (another angle of the same play), or detaches it with null. */
export async function placeClip(app: AppContext, sessionId: number, clipId: number, snapId: number | null): Promise<void> {
  if (snapId !== null) {
    const snap = await app.db.selectFrom('snaps').select('id').where('id', '=', snapId).where('session_id', '=', sessionId).executeTakeFirst();
    if (!snap) throw validationFailed('That snap is not in this session.', { snapId: 'Not in this session.' });
  }
  const result = await app.db.updateTable('clips').set({ snap_id: snapId }).where('id', '=', clipId).where('session_id', '=', sessionId).executeTakeFirst();
  if (Number(result.numUpdatedRows) === 0) throw notFound('That clip');
}

// ---- CSV of play data, our own columns ----------------------------------------------------------
export const SNAP_CSV_COLUMNS = ['snap', 'quarter', 'down', 'distance', 'yard_line', 'side', 'hash', 'personnel', 'formation', 'concept', 'direction', 'front', 'gain', 'outcome', 'period', 'notes'] as const;

async function tagNames(db: Database, teamId: number) {
  await ensureDefaultTagLists(db, teamId);
  const rows = await db.selectFrom('tag_list_items').select(['id', 'kind', 'name']).where('team_id', '=', teamId).execute();
  return {
    byId: new Map(rows.map((r) => [r.id, r.name])),
    byName: (kind: TagListKind, name: string) => rows.find((r) => r.kind === kind && r.name.toLowerCase() === name.trim().toLowerCase())?.id,
  };
}

export async function exportSnapsCsv(app: AppContext, teamId: number, sessionId: number): Promise<string> {
  const [snaps, names] = await Promise.all([listSessionSnaps(app, sessionId), tagNames(app.db, teamId)]);
  const name = (id: number | null) => (id === null ? '' : (names.byId.get(id) ?? ''));
  const records = snaps.map((s) => Object.fromEntries(Object.entries({
    snap: s.order, quarter: s.quarter ?? '', down: s.down ?? '', distance: s.distance ?? '', yard_line: s.yardLine ?? '', side: s.fieldSide ?? '',
    hash: s.hash ?? '', personnel: s.personnel ?? '', formation: name(s.formationId), concept: name(s.conceptId), direction: s.direction ?? '',
    front: name(s.frontId), gain: s.resultYards ?? '', outcome: name(s.outcomeId), period: s.period ?? '', notes: s.notes ?? '',
  }).map(([k, v]) => [k, defuseCell(v)])));
  return stringify(records, { header: true, columns: [...SNAP_CSV_COLUMNS] });
}

/**
 * Imports play data for existing snaps (matched by the "snap" column, the snap's order), all or
 * nothing: every row is checked first and each bad row is reported by row number and column.
 */
export async function importSnapsCsv(app: AppContext, teamId: number, sessionId: number, csv: string): Promise<{ updated: number }> {
  let records: Record<string, string>[];
  try {
    records = parse(csv, { bom: true, columns: (h: string[]) => h.map((c) => c.trim().toLowerCase()), skip_empty_lines: true, trim: true }) as Record<string, string>[];
  } catch (error) {
    throw validationFailed('Nothing was imported: the file is not valid CSV.', undefined, { rows: [{ row: (error as { lines?: number }).lines ?? 1, field: 'file', message: 'Not valid CSV.' }] });
  }
  const errors: { row: number; field: string; message: string }[] = [];
  if (records.length > 0 && !('snap' in records[0]!)) errors.push({ row: 1, field: 'snap', message: 'The header has no "snap" column.' });
  const unknown = records.length > 0 ? Object.keys(records[0]!).filter((c) => !(SNAP_CSV_COLUMNS as readonly string[]).includes(c)) : [];
  for (const c of unknown) errors.push({ row: 1, field: c, message: `Unknown column "${c}". Columns are ${SNAP_CSV_COLUMNS.join(', ')}.` });
  const snaps = await listSnaps(app.db, sessionId);
  const names = await tagNames(app.db, teamId);
  const planned: { snapId: number; tags: SnapTagsUpdate }[] = [];
  const int = (text: string | undefined) => (text === undefined || text === '' ? null : Number(text));
  const str = (text: string | undefined) => (text === undefined || text === '' ? null : restoreCell(text));
  records.forEach((r, i) => {
    const row = i + 2;
    const snap = snaps.find((s) => s.order === Number(r.snap));
    if (!snap) {
      errors.push({ row, field: 'snap', message: `There is no snap ${r.snap ?? ''} in this session.` });
      return;
    }
    const tagId = (kind: TagListKind, field: string) => {
      const text = r[field];
      if (!text) return null;
      const id = names.byName(kind, text);
      if (id === undefined) errors.push({ row, field, message: `"${text}" is not on the team's ${kind} list.` });
      return id ?? null;
    };
    const candidate = {
      quarter: int(r.quarter), down: int(r.down), distance: int(r.distance), yardLine: int(r.yard_line), fieldSide: str(r.side?.toLowerCase()),
      hash: str(r.hash?.toLowerCase()), personnel: str(r.personnel), formationId: tagId('formation', 'formation'), conceptId: tagId('concept', 'concept'),
      direction: str(r.direction?.toLowerCase()), frontId: tagId('front', 'front'), resultYards: int(r.gain), outcomeId: tagId('outcome', 'outcome'),
      period: str(r.period), notes: str(r.notes),
    };
    const parsed = snapTagsSchema.safeParse(candidate);
    if (!parsed.success) {
      const columnOf: Record<string, string> = { yardLine: 'yard_line', fieldSide: 'side', resultYards: 'gain' };
      for (const [field, message] of Object.entries(fieldErrors(parsed.error))) errors.push({ row, field: columnOf[field] ?? field, message });
      return;
    }
    planned.push({ snapId: snap.id, tags: parsed.data });
  });
  if (errors.length > 0) throw validationFailed(`Nothing was imported: ${errors.length} problem${errors.length === 1 ? '' : 's'} found.`, undefined, { rows: errors });
  await app.db.transaction().execute(async (trx) => {
    for (const p of planned) await trx.updateTable('snaps').set({ ...columnsOf(p.tags), updated_at: app.now() }).where('id', '=', p.snapId).execute();
  });
  return { updated: planned.length };
}
