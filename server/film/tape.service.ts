import type { Clip } from '@shared/api/film';
import { MIN_SEGMENT_MS } from '@shared/film';
import type { AppContext } from '../core/context';
import { conflict, notFound, validationFailed } from '../core/errors';
import { findClip } from './film.repository';
import { getClip } from './clips.service';


async function readyTape(app: AppContext, clipId: number) {
  const tape = await findClip(app.db, clipId);
  if (!tape) throw notFound('That clip');
  if (tape.kind !== 'tape') throw conflict('Only a continuous tape can be split into snaps.');
  if (tape.status !== 'ready' || tape.duration_ms === null) throw conflict('The tape is still being processed; cut it when it is ready.');
  return tape;
}

/** Runs scene detection again with another threshold; the proposal replaces the previous one. */
export async function redetectCuts(app: AppContext, clipId: number, threshold: number): Promise<Clip> {
  await readyTape(app, clipId);
  await app.db.transaction().execute(async (trx) => {
    await trx.updateTable('clips').set({ status: 'processing', progress: 0, updated_at: app.now() }).where('id', '=', clipId).execute();
    await app.jobs.send('tape.detect', { clipId, threshold }, trx);
  });
  return getClip(app, clipId);
}

/**
 * Confirms the cut points of a tape: checks them (inside the tape, increasing, segments of at least
 * MIN_SEGMENT_MS) and queues the split. The worker then makes one snap clip per segment.
 */
export async function confirmCuts(app: AppContext, clipId: number, cutsMs: number[]): Promise<Clip> {
  const tape = await readyTape(app, clipId);
  const sorted = [...new Set(cutsMs)].sort((a, b) => a - b);
  const bounds = [0, ...sorted, tape.duration_ms!];
  for (let i = 1; i < bounds.length; i += 1) {
    if (bounds[i]! - bounds[i - 1]! < MIN_SEGMENT_MS) {
      throw validationFailed('Cuts must lie inside the tape and leave at least half a second between them.', { cutsMs: `Too close near ${Math.round(bounds[i]!)} ms.` });
    }
  }
  const already = await app.db.selectFrom('clips').select('id').where('source_clip_id', '=', clipId).limit(1).executeTakeFirst();
  if (already) throw conflict('This tape has been split already. Remove its snap clips first to split it again.');
  await app.db.transaction().execute(async (trx) => {
    await trx.updateTable('clips').set({ proposed_cuts: JSON.stringify(sorted), status: 'processing', progress: 0, updated_at: app.now() }).where('id', '=', clipId).execute();
    await app.jobs.send('tape.split', { clipId, cutsMs: sorted }, trx);
  });
  return getClip(app, clipId);
}
