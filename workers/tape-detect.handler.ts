import path from 'node:path';
import type { JobHandler } from './handlers';
import { downloadObject, loadClip, markFailed } from './clip-store';
import { humanReason } from './media-ops';

/** Scene detection on a tape with the threshold the analyst chose; the proposal replaces the old one. */
export const detectTapeCuts: JobHandler<'tape.detect'> = async (deps, { clipId, threshold }) => {
  const { db, storage, media } = deps;
  const tape = await loadClip(db, clipId);
  if (!tape || !tape.original_key) return;
  try {
    const cuts = await media.withTempDir(async (dir) => {
      const input = path.join(dir, 'tape');
      await downloadObject(storage, tape.original_key!, input);
      return media.detectScenes(input, threshold);
    });
    await db
      .updateTable('clips')
      .set({ proposed_cuts: JSON.stringify(cuts.map((s) => Math.round(s * 1000))), status: 'ready', progress: 100, updated_at: new Date() })
      .where('id', '=', clipId)
      .execute();
  } catch (error) {
    const reason = humanReason(error);
    if (!reason) throw error;
    await markFailed(db, clipId, reason);
  }
};
