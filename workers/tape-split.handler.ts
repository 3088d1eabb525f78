import path from 'node:path';
import { objectKeys } from '../server/core/object-keys';
import type { JobHandler } from './handlers';
import { downloadObject, loadClip, markFailed, setProgress, uploadFile } from './clip-store';
import { humanReason } from './media-ops';

/**
 * Cuts a tape into one clip per segment between the confirmed cuts, places them on new snaps after
 * the session's last one, and queues each for processing. A re-run reuses the clips made before
 * (matched by their start on the tape) and overwrites their cut files.
 */
export const splitTape: JobHandler<'tape.split'> = async (deps, { clipId, cutsMs }) => {
  const { db, storage, media, jobs } = deps;
  const tape = await loadClip(db, clipId);
  if (!tape || !tape.original_key || tape.duration_ms === null) return;
  const bounds = [0, ...cutsMs, tape.duration_ms];
  const segments = bounds.slice(1).map((end, i) => ({ startMs: bounds[i]!, endMs: end }));

  const pieces = await db.transaction().execute(async (trx) => {
    const existing = await trx.selectFrom('clips').select(['id', 'source_start_ms']).where('source_clip_id', '=', clipId).execute();
    if (existing.length === segments.length) return existing.map((c) => ({ id: c.id, startMs: c.source_start_ms! })).sort((a, b) => a.startMs - b.startMs);
    await trx.selectFrom('film_sessions').select('id').where('id', '=', tape.session_id).forUpdate().execute();
    const maxSnap = await trx.selectFrom('snaps').select((eb) => eb.fn.max('order').as('m')).where('session_id', '=', tape.session_id).executeTakeFirst();
    const maxUpload = await trx.selectFrom('clips').select((eb) => eb.fn.max('upload_order').as('m')).where('session_id', '=', tape.session_id).executeTakeFirst();
    let snapOrder = Number(maxSnap?.m ?? 0);
    let uploadOrder = Number(maxUpload?.m ?? 0);
    const made: { id: number; startMs: number }[] = [];
    for (const [i, segment] of segments.entries()) {
      const snap = await trx.insertInto('snaps').values({ session_id: tape.session_id, order: ++snapOrder }).returning('id').executeTakeFirstOrThrow();
      const clip = await trx
        .insertInto('clips')
        .values({
          team_id: tape.team_id,
          session_id: tape.session_id,
          snap_id: snap.id,
          kind: 'snap',
          angle: tape.angle,
          upload_order: ++uploadOrder,
          original_name: `tape ${clipId} · snap ${i + 1}`,
          status: 'received',
          source_clip_id: clipId,
          source_start_ms: segment.startMs,
          source_end_ms: segment.endMs,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      made.push({ id: clip.id, startMs: segment.startMs });
    }
    return made;
  });

  try {
    await media.withTempDir(async (dir) => {
      const input = path.join(dir, 'tape');
      await downloadObject(storage, tape.original_key!, input);
      const probe = await media.probe(input);
      for (const [i, piece] of pieces.entries()) {
        const segment = segments[i]!;
        const output = path.join(dir, `snap-${i + 1}.mp4`);
        await media.cut(input, output, segment.startMs, segment.endMs, probe);
        const key = objectKeys.cutOriginal(tape.team_id, piece.id);
        await uploadFile(storage, key, output, 'video/mp4');
        await db.transaction().execute(async (trx) => {
          await trx.updateTable('clips').set({ original_key: key, updated_at: new Date() }).where('id', '=', piece.id).execute();
          await jobs.send('clip.process', { clipId: piece.id }, trx);
        });
        await setProgress(db, clipId, Math.round(((i + 1) / pieces.length) * 100));
      }
    });
    await db.updateTable('clips').set({ status: 'ready', progress: 100, updated_at: new Date() }).where('id', '=', clipId).execute();
  } catch (error) {
    const reason = humanReason(error);
    if (!reason) throw error;
    await markFailed(db, clipId, `the tape could not be cut: ${reason}`);
  }
};
