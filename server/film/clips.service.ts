import { pipeline } from 'node:stream/promises';
import type { Readable } from 'node:stream';
import type { Request, Response } from 'express';
import multer from 'multer';
import { uploadFieldsSchema, type Clip, type UploadResponse } from '@shared/api/film';
import type { Angle, ClipKind, ClipState } from '@shared/film';
import type { AppContext } from '../core/context';
import { AppError, conflict, notFound, validationFailed } from '../core/errors';
import { objectKeys } from '../core/object-keys';
import { findClip, listSessionClips, listSnapClips, listSnaps, type ClipRow } from './film.repository';
import { mediaUrl, type MediaVariant } from './media-urls';
import { batchPlayNumbers, planPlacements } from './snap-numbering';
import { ObjectStorageEngine, type StoredUpload } from './upload-engine';

export function toClip(row: ClipRow, splitTapeIds: ReadonlySet<number> = new Set()): Clip {
  const ready = row.status === 'ready';
  return {
    id: row.id,
    sessionId: row.session_id,
    snapId: row.snap_id,
    kind: row.kind as ClipKind,
    angle: row.angle as Angle,
    originalName: row.original_name,
    status: row.status as ClipState,
    failureReason: row.failure_reason,
    progress: row.progress,
    durationMs: row.duration_ms,
    width: row.width,
    height: row.height,
    fps: row.fps === null ? null : Number(row.fps),
    sizeBytes: row.size_bytes,
    posterUrl: row.poster_key ? mediaUrl(row.id, 'poster') : null,
    playbackUrl: ready && row.rendition_key ? mediaUrl(row.id, 'playback') : null,
    stripUrl: row.strip_key ? mediaUrl(row.id, 'strip') : null,
    strip: row.strip,
    proposedCutsMs: row.proposed_cuts,
    canRetry: row.status === 'failed' && row.original_key !== null,
    splitDone: splitTapeIds.has(row.id),
    createdAt: row.created_at.toISOString(),
  };
}

export async function getClip(app: AppContext, clipId: number): Promise<Clip> {
  const row = await findClip(app.db, clipId);
  if (!row) throw notFound('That clip');
  const child = row.kind === 'tape' ? await app.db.selectFrom('clips').select('id').where('source_clip_id', '=', clipId).limit(1).executeTakeFirst() : undefined;
  return toClip(row, new Set(child ? [clipId] : []));
}

export async function listClips(app: AppContext, sessionId: number): Promise<Clip[]> {
  const rows = await listSessionClips(app.db, sessionId);
  const split = new Set(rows.flatMap((r) => (r.source_clip_id !== null ? [r.source_clip_id] : [])));
  return rows.map((r) => toClip(r, split));
}

type UploadedFile = Express.Multer.File & { upload?: StoredUpload };

/** Names are kept as data only: strip path parts and control characters, keep it short. */
export function cleanOriginalName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  const cleaned = base.replace(/[\u0000-\u001f\u007f]/g, '').trim().slice(0, 200);
  return cleaned || 'unnamed';
}

function runMulter(app: AppContext, req: Request, res: Response, teamId: number, sessionId: number): Promise<void> {
  const upload = multer({
    storage: new ObjectStorageEngine(app.storage, () => objectKeys.original(teamId, sessionId)),
    limits: {
      fileSize: app.config.media.maxUploadBytes,
      files: app.config.media.maxUploadFiles,
      fields: 10,
      fieldSize: 1024,
      parts: app.config.media.maxUploadFiles + 10,
      headerPairs: 200,
    },
  }).array('files', app.config.media.maxUploadFiles);
  return new Promise((resolve, reject) => upload(req, res, (error?: unknown) => (error ? reject(error) : resolve())));
}

function multerToAppError(app: AppContext, error: unknown): unknown {
  if (error instanceof multer.MulterError) {
    app.logger.warn({ event: 'upload_rejected', code: error.code }, 'upload rejected');
    if (error.code === 'LIMIT_FILE_SIZE') {
      const gib = app.config.media.maxUploadBytes / 1024 ** 3;
      const limit = gib >= 1 ? `${Math.round(gib * 10) / 10} GiB` : `${Math.round(app.config.media.maxUploadBytes / 1024 ** 2)} MiB`;
      return new AppError(413, 'payload_too_large', `A file is larger than the upload limit (${limit}). Nothing from this upload was kept.`);
    }
    if (error.code === 'LIMIT_FILE_COUNT' || error.code === 'LIMIT_PART_COUNT') {
      return new AppError(413, 'payload_too_large', `Upload at most ${app.config.media.maxUploadFiles} files at once.`);
    }
    if (error.code === 'LIMIT_UNEXPECTED_FILE') return validationFailed('Send the files in the field "files".', { files: 'Unexpected field.' });
    return validationFailed(`The upload could not be read (${error.code}).`);
  }
  const message = (error as Error)?.message ?? '';
  if (/Malformed part header/i.test(message)) {
    return new AppError(400, 'bad_request', "The upload's form data could not be read: a file name may hold control characters. Rename the file and upload it again.");
  }
  if (/Unexpected end of form|Multipart: Boundary not found|Unsupported content type/i.test(message)) {
    return new AppError(400, 'bad_request', 'The upload was cut off or is not multipart/form-data with files in the field "files".');
  }
  if ((error as { code?: string })?.code === 'LIMIT_FILE_SIZE') return multerToAppError(app, new multer.MulterError('LIMIT_FILE_SIZE'));
  if ((error as { $metadata?: unknown; name?: string })?.$metadata !== undefined || /ECONNREFUSED|socket hang up/i.test(message)) {
    app.logger.error({ event: 'storage_unavailable', err: error }, 'object storage failed during upload');
    return new AppError(503, 'service_unavailable', 'Film storage is not reachable right now. Nothing from this upload was kept; try again shortly.');
  }
  return error;
}

/**
 * Receives one or more clips for a session: streams each into storage, refuses files that are not
 * video by their bytes (recorded as failed clips with the reason) and files already in the session
 * (skipped), places snap clips on snaps, and enqueues processing in the same transaction.
 */
export async function receiveUpload(app: AppContext, req: Request, res: Response, teamId: number, sessionId: number, userId: number): Promise<UploadResponse> {
  try {
    await runMulter(app, req, res, teamId, sessionId);
  } catch (error) {
    throw multerToAppError(app, error);
  }
  const files = ((req.files as UploadedFile[] | undefined) ?? []).filter((f) => f.upload);
  const storedKeys = files.flatMap((f) => (f.upload?.outcome === 'stored' ? [f.upload.key] : []));
  try {
    if (files.length === 0) throw validationFailed('Choose at least one video file.', { files: 'No file was sent.' });
    const fields = uploadFieldsSchema.safeParse({ angle: req.body?.angle, kind: req.body?.kind });
    if (!fields.success) {
      throw validationFailed('Check the upload fields.', Object.fromEntries(fields.error.issues.map((i) => [String(i.path[0]), i.message])));
    }
    const result = await recordUploads(app, files, { teamId, sessionId, userId, angle: fields.data.angle, kind: fields.data.kind });
    const keptKeys = new Set(result.keptKeys);
    const unused = storedKeys.filter((k) => !keptKeys.has(k));
    if (unused.length > 0) await app.storage.remove(unused);
    return result.response;
  } catch (error) {
    // Nothing half-recorded: the stored objects of a failed upload are removed.
    if (storedKeys.length > 0) await app.storage.remove(storedKeys).catch((e: unknown) => app.logger.error({ err: e, keys: storedKeys }, 'could not remove objects of a failed upload'));
    throw error;
  }
}

async function recordUploads(
  app: AppContext,
  files: UploadedFile[],
  meta: { teamId: number; sessionId: number; userId: number; angle: Angle; kind: 'snap' | 'tape' },
): Promise<{ response: UploadResponse; keptKeys: string[] }> {
  return app.db.transaction().execute(async (trx) => {
    // One upload at a time per session decides upload order and snap placement.
    await trx.selectFrom('film_sessions').select('id').where('id', '=', meta.sessionId).forUpdate().executeTakeFirstOrThrow();
    const existing = await trx.selectFrom('clips').select(['id', 'sha256', 'upload_order']).where('session_id', '=', meta.sessionId).execute();
    const byHash = new Map(existing.filter((c) => c.sha256).map((c) => [c.sha256!, c.id]));
    let nextOrder = existing.reduce((m, c) => Math.max(m, c.upload_order), 0) + 1;
    const response: UploadResponse = { clips: [], skipped: [] };
    const keptKeys: string[] = [];
    const accepted: { file: UploadedFile; name: string }[] = [];
    for (const file of files) {
      const name = cleanOriginalName(file.originalname);
      const upload = file.upload!;
      if (upload.outcome === 'stored') {
        const duplicateOf = byHash.get(upload.sha256);
        if (duplicateOf !== undefined) {
          response.skipped.push({ originalName: name, reason: 'the same file is already in this session', duplicateOfClipId: duplicateOf });
          continue;
        }
        byHash.set(upload.sha256, -1);
        accepted.push({ file, name });
      } else {
        app.logger.warn({ event: 'upload_rejected', reason: upload.reason }, 'file refused by its content');
        const row = await trx
          .insertInto('clips')
          .values({
            team_id: meta.teamId,
            session_id: meta.sessionId,
            kind: meta.kind,
            angle: meta.angle,
            upload_order: nextOrder++,
            original_name: name,
            status: 'failed',
            failure_reason: upload.reason,
            size_bytes: upload.size,
            created_by: meta.userId,
          })
          .returning(['id', 'status'])
          .executeTakeFirstOrThrow();
        response.clips.push({ id: row.id, status: row.status as ClipState, originalName: name, snapId: null });
      }
    }
    const placements =
      meta.kind === 'snap'
        ? await planSnapPlacements(trx as unknown as AppContext['db'], meta.sessionId, meta.angle, accepted.map((a) => a.name))
        : accepted.map(() => null);
    for (const [i, { file, name }] of accepted.entries()) {
      const upload = file.upload as Extract<StoredUpload, { outcome: 'stored' }>;
      const snapId = await resolvePlacement(trx as unknown as AppContext['db'], meta.sessionId, placements[i] ?? null);
      const row = await trx
        .insertInto('clips')
        .values({
          team_id: meta.teamId,
          session_id: meta.sessionId,
          snap_id: snapId,
          kind: meta.kind,
          angle: meta.angle,
          upload_order: nextOrder++,
          original_name: name,
          status: 'received',
          sha256: upload.sha256,
          size_bytes: upload.size,
          original_key: upload.key,
          created_by: meta.userId,
        })
        .returning(['id', 'status'])
        .executeTakeFirstOrThrow();
      await app.jobs.send('clip.process', { clipId: row.id }, trx);
      keptKeys.push(upload.key);
      response.clips.push({ id: row.id, status: row.status as ClipState, originalName: name, snapId });
    }
    return { response, keptKeys };
  });
}

async function planSnapPlacements(db: AppContext['db'], sessionId: number, angle: Angle, names: string[]) {
  const [snaps, clips] = await Promise.all([listSnaps(db, sessionId), listSnapClips(db, sessionId)]);
  const slots = snaps.map((s) => ({ id: s.id, order: s.order, angles: new Set(clips.filter((c) => c.snap_id === s.id).map((c) => c.angle)) }));
  const numbers = batchPlayNumbers(names);
  return planPlacements(slots, names.map((_, i) => ({ angle, playNumber: numbers[i] ?? null })));
}

async function resolvePlacement(db: AppContext['db'], sessionId: number, placement: ReturnType<typeof planPlacements>[number] | null): Promise<number | null> {
  if (!placement) return null;
  if ('snapId' in placement) return placement.snapId;
  const found = await db.selectFrom('snaps').select('id').where('session_id', '=', sessionId).where('order', '=', placement.newOrder).executeTakeFirst();
  if (found) return found.id;
  const created = await db.insertInto('snaps').values({ session_id: sessionId, order: placement.newOrder }).returning('id').executeTakeFirstOrThrow();
  return created.id;
}

/** Removes a clip and its stored objects (original, poster, strip, rendition). */
export async function removeClip(app: AppContext, clipId: number): Promise<void> {
  const row = await findClip(app.db, clipId);
  if (!row) throw notFound('That clip');
  if (row.status === 'processing') throw conflict('The clip is being processed; remove it when it is ready or failed.');
  const cutsFromTape = await app.db.selectFrom('clips').select('id').where('source_clip_id', '=', clipId).execute();
  const keys = [row.original_key, row.poster_key, row.strip_key, row.rendition_key].filter((k): k is string => Boolean(k));
  await app.db.transaction().execute(async (trx) => {
    if (cutsFromTape.length > 0) await trx.updateTable('clips').set({ source_clip_id: null }).where('source_clip_id', '=', clipId).execute();
    await trx.deleteFrom('clips').where('id', '=', clipId).execute();
  });
  // A cut clip may share its rendition with nothing else; the original of a tape is its own object.
  if (keys.length > 0) await app.storage.remove(keys);
}

/** Sends a failed clip through processing again. */
export async function retryClip(app: AppContext, clipId: number): Promise<Clip> {
  const row = await findClip(app.db, clipId);
  if (!row) throw notFound('That clip');
  if (row.status !== 'failed') throw conflict('Only a failed clip can be retried.');
  if (!row.original_key) throw conflict('This file was refused on upload (it is not a video); remove it and upload the right file.');
  await app.db.transaction().execute(async (trx) => {
    await trx.updateTable('clips').set({ status: 'received', failure_reason: null, progress: 0, updated_at: new Date() }).where('id', '=', clipId).execute();
    await app.jobs.send('clip.process', { clipId }, trx);
  });
  return getClip(app, clipId);
}

const CONTENT_TYPES: Record<MediaVariant, string> = { poster: 'image/jpeg', strip: 'image/jpeg', playback: 'video/mp4' };

/** Streams a clip's poster, strip or playable video, answering Range requests with 206. */
export async function streamClipMedia(app: AppContext, req: Request, res: Response, clipId: number, variant: MediaVariant): Promise<void> {
  const row = await findClip(app.db, clipId);
  const key = row && { poster: row.poster_key, strip: row.strip_key, playback: row.status === 'ready' ? row.rendition_key : null }[variant];
  if (!row || !key) throw notFound(variant === 'playback' ? 'A playable video of that clip' : `The ${variant} of that clip`);
  const range = req.get('range');
  if (range && !/^bytes=\d*-\d*$/.test(range)) throw new AppError(416, 'bad_request', 'Only a single byte range is supported.');
  let object;
  try {
    object = await app.storage.get(key, range);
  } catch (error) {
    const status = (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
    if (status === 416) {
      const head = await app.storage.head(key);
      // The same JSON error shape as every other refusal; a media element reads only the status and Content-Range.
      res
        .status(416)
        .set('Content-Range', `bytes */${head?.size ?? 0}`)
        .json({ error: { code: 'bad_request', message: 'The requested byte range is outside the file.', requestId: (req as { id?: string }).id } });
      return;
    }
    if (status === 404) throw notFound(`The ${variant} of that clip`);
    throw new AppError(503, 'service_unavailable', 'Film storage is not reachable right now.');
  }
  res.status(object.ContentRange ? 206 : 200);
  res.set({
    'Content-Type': CONTENT_TYPES[variant],
    'Accept-Ranges': 'bytes',
    'Cache-Control': 'private, max-age=300',
    'Content-Disposition': 'inline',
    ...(object.ContentLength !== undefined ? { 'Content-Length': String(object.ContentLength) } : {}),
    ...(object.ContentRange ? { 'Content-Range': object.ContentRange } : {}),
  });
  if (req.method === 'HEAD') {
    (object.Body as Readable | undefined)?.destroy();
    res.end();
    return;
  }
  try {
    await pipeline(object.Body as Readable, res);
  } catch {
    // The viewer seeked away or closed the tab: nothing to report.
    res.destroy();
  }
}
