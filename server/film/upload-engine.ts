import { createHash } from 'node:crypto';
import { PassThrough } from 'node:stream';
import type { Request } from 'express';
import type multer from 'multer';
import type { ObjectStorage } from '../core/storage';
import { SNIFF_BYTES, sniffContainer } from './content-sniff';

/** What the engine reports per file: stored (key, size, hash) or rejected by its first bytes. */
export type StoredUpload =
  | { outcome: 'stored'; key: string; size: number; sha256: string; container: string }
  | { outcome: 'rejected'; reason: string; size: number };

type UploadedFile = Express.Multer.File & { upload?: StoredUpload };

/**
 * A multer storage engine that streams each file straight into object storage (multipart through
 * lib-storage), hashing and counting on the way, without holding the file in memory or on disk.
 * The first bytes are checked before anything is stored: a file that cannot be a video is drained
 * and reported as rejected, so the other files of the request still go through.
 */
export class ObjectStorageEngine implements multer.StorageEngine {
  constructor(
    private readonly storage: ObjectStorage,
    private readonly keyFor: (req: Request) => string,
  ) {}

  _handleFile(req: Request, file: Express.Multer.File, callback: (error?: unknown, info?: Partial<UploadedFile>) => void): void {
    const stream = file.stream;
    const key = this.keyFor(req);
    const hash = createHash('sha256');
    let size = 0;
    const head: Buffer[] = [];
    let headLength = 0;
    let state: 'sniffing' | 'storing' | 'draining' = 'sniffing';
    let container = 'unknown';
    let rejectedReason = '';
    let body: PassThrough | undefined;
    let upload: ReturnType<ObjectStorage['upload']> | undefined;
    let settled = false;

    const settle = (error?: unknown, info?: StoredUpload) => {
      if (settled) return;
      settled = true;
      if (error) callback(error);
      else callback(undefined, { upload: info, size: info?.size ?? size });
    };

    // Stops storing (the object, or the parts uploaded so far, are removed) and reports the error.
    const fail = (error: unknown) => {
      if (settled) return;
      state = 'draining';
      body?.destroy();
      const pending = upload;
      upload = undefined;
      void (pending ? pending.abort() : Promise.resolve()).then(() => settle(error));
    };

    const decide = () => {
      const verdict = sniffContainer(Buffer.concat(head));
      if (!verdict.ok) {
        state = 'draining';
        rejectedReason = verdict.reason;
        return;
      }
      state = 'storing';
      container = verdict.container;
      body = new PassThrough({ highWaterMark: 1024 * 1024 });
      upload = this.storage.upload(key, body, 'application/octet-stream');
      upload.done.then(
        () => settle(undefined, { outcome: 'stored', key, size, sha256: hash.digest('hex'), container }),
        (error: unknown) => fail(error),
      );
      body.write(Buffer.concat(head));
    };

    stream.on('data', (chunk: Buffer) => {
      hash.update(chunk);
      size += chunk.length;
      if (state === 'sniffing') {
        head.push(chunk);
        headLength += chunk.length;
        if (headLength >= SNIFF_BYTES) decide();
      } else if (state === 'storing' && body && !body.write(chunk)) {
        // Backpressure: hold the request until the store has taken what it has.
        stream.pause();
        body.once('drain', () => stream.resume());
      }
    });
    stream.on('end', () => {
      if (state === 'sniffing') decide();
      if (state === 'storing') body?.end();
      else if (rejectedReason) settle(undefined, { outcome: 'rejected', reason: rejectedReason, size });
    });
    stream.on('limit', () => fail(Object.assign(new Error('The file is larger than the upload limit.'), { code: 'LIMIT_FILE_SIZE' })));
    stream.on('error', (error: Error) => fail(error));
  }

  _removeFile(_req: Request, file: Express.Multer.File & { upload?: StoredUpload }, callback: (error: Error | null) => void): void {
    const upload = file.upload;
    if (upload?.outcome !== 'stored') return callback(null);
    this.storage.remove([upload.key]).then(
      () => callback(null),
      (error: Error) => callback(error),
    );
  }
}
