import type { JobHandler } from './handlers';

/**
 * A clip job used up its attempts (or its worker kept dying): the clip must not stay "processing".
 * It ends failed with the last interruption as the reason, and can be retried from the library.
 */
export const clipJobDead: JobHandler<'clip.dead'> = async (deps, { clipId }) => {
  const clip = await deps.db.selectFrom('clips').select(['status', 'failure_reason']).where('id', '=', clipId).executeTakeFirst();
  if (!clip || clip.status === 'ready' || clip.status === 'failed') return;
  const last = clip.failure_reason?.replace(/^interrupted: /, '') ?? 'no answer from the worker';
  await deps.db
    .updateTable('clips')
    .set({ status: 'failed', failure_reason: `processing stopped after several attempts (${last})`.slice(0, 300), updated_at: new Date() })
    .where('id', '=', clipId)
    .execute();
  deps.logger.warn({ event: 'clip_failed', clipId, reason: 'attempts exhausted' }, 'clip job dead-lettered');
};
