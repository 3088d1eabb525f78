import path from 'node:path';
import { objectKeys } from '../server/core/object-keys';
import type { JobHandler } from './handlers';
import { downloadObject, loadClip, markFailed, uploadFile } from './clip-store';
import { humanReason } from './media-ops';

/** Proposed cuts for a new tape use this scene-change threshold (0–1); the Cut Planner can re-run it. */
export const DEFAULT_SCENE_THRESHOLD = 0.3;

/**
 * One uploaded clip: probe → poster → scrub strip → web rendition (→ proposed cuts for a tape).
 * Idempotent: outputs have fixed keys, so a re-run after a crash overwrites instead of adding copies,
 * and a clip already ready is left alone. A file ffmpeg cannot read fails with a human reason and is
 * not retried; anything else (storage down, worker killed) is retried by the queue.
 */
export const processClip: JobHandler<'clip.process'> = async (deps, { clipId }, jobId) => {
  const { db, storage, media, config, logger } = deps;
  const clip = await loadClip(db, clipId);
  if (!clip || !clip.original_key || clip.status === 'ready') return;
  await db.updateTable('clips').set({ status: 'processing', progress: 5, updated_at: new Date() }).where('id', '=', clipId).execute();
  try {
    await media.withTempDir(async (dir) => {
      const input = path.join(dir, 'original');
      await downloadObject(storage, clip.original_key!, input);
      const probe = await media.probe(input);
      if (!probe.hasVideo) throw Object.assign(new Error('no video'), { reason: 'the file has no video stream (audio only)' });
      await db
        .updateTable('clips')
        .set({
          duration_ms: probe.durationMs,
          width: probe.width,
          height: probe.height,
          fps: probe.fps,
          video_codec: probe.videoCodec,
          audio_codec: probe.audioCodec,
          rotation: probe.rotation,
          progress: 20,
        })
        .where('id', '=', clipId)
        .execute();

      const poster = path.join(dir, 'poster.jpg');
      await media.poster(input, poster, probe);
      await uploadFile(storage, objectKeys.poster(clip.team_id, clipId), poster, 'image/jpeg');
      await db.updateTable('clips').set({ poster_key: objectKeys.poster(clip.team_id, clipId), progress: 40 }).where('id', '=', clipId).execute();

      const strip = path.join(dir, 'strip.jpg');
      const layout = await media.strip(input, strip, probe, config.media.stripFrames);
      await uploadFile(storage, objectKeys.strip(clip.team_id, clipId), strip, 'image/jpeg');
      await db
        .updateTable('clips')
        .set({ strip_key: objectKeys.strip(clip.team_id, clipId), strip: JSON.stringify(layout), progress: 60 })
        .where('id', '=', clipId)
        .execute();

      const web = path.join(dir, 'web.mp4');
      const action = await media.rendition(input, web, probe, config.media.renditionMaxHeight);
      let renditionKey = clip.original_key!;
      if (action !== 'skip') {
        renditionKey = objectKeys.rendition(clip.team_id, clipId);
        await uploadFile(storage, renditionKey, web, 'video/mp4');
      }
      await db.updateTable('clips').set({ rendition_key: renditionKey, progress: 90 }).where('id', '=', clipId).execute();

      let proposedCuts: number[] | undefined;
      if (clip.kind === 'tape') proposedCuts = (await media.detectScenes(input, DEFAULT_SCENE_THRESHOLD)).map((s) => Math.round(s * 1000));
      await db
        .updateTable('clips')
        .set({
          status: 'ready',
          progress: 100,
          failure_reason: null,
          updated_at: new Date(),
          ...(proposedCuts ? { proposed_cuts: JSON.stringify(proposedCuts) } : {}),
        })
        .where('id', '=', clipId)
        .execute();
      logger.info({ event: 'clip_ready', clipId, jobId, rendition: action }, 'clip ready');
    });
  } catch (error) {
    const reason = humanReason(error);
    if (reason) {
      await markFailed(db, clipId, reason);
      logger.warn({ event: 'clip_failed', clipId, jobId, reason }, 'clip failed');
      return;
    }
    // A passing fault: keep the clip in processing with a note; the queue retries, then dead-letters.
    await db.updateTable('clips').set({ failure_reason: `interrupted: ${(error as Error).message}`.slice(0, 300) }).where('id', '=', clipId).execute().catch(() => undefined);
    throw error;
  }
};
