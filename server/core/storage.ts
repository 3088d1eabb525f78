import { Readable } from 'node:stream';
import {
  CreateBucketCommand,
  DeleteObjectsCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  S3Client,
  type GetObjectCommandOutput,
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import type { Config } from './config';

// The SDK version is pinned for Node 20 (see README); its reminder to move to Node 22 is known.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';

/**
 * Object storage (any S3-compatible store; s3rver locally). Checksums are computed only when the
 * API requires them: with the SDK's default checksums s3rver silently corrupts streamed uploads.
 */
export interface ObjectStorage {
  readonly bucket: string;
  ensureBucket(): Promise<void>;
  /** Streams a body into an object (multipart for large bodies); `abort` stops it and leaves nothing. */
  upload(key: string, body: Readable | Buffer, contentType: string): { done: Promise<void>; abort: () => Promise<void> };
  get(key: string, range?: string): Promise<GetObjectCommandOutput>;
  head(key: string): Promise<{ size: number; contentType: string | undefined } | null>;
  remove(keys: string[]): Promise<void>;
  /** Every key under a prefix (for clean-up checks and backups). */
  list(prefix: string): Promise<string[]>;
  destroy(): void;
}

export function createS3Client(config: Config): S3Client {
  return new S3Client({
    endpoint: config.s3.endpoint,
    region: config.s3.region,
    forcePathStyle: config.s3.forcePathStyle,
    credentials: { accessKeyId: config.s3.accessKeyId, secretAccessKey: config.s3.secretAccessKey },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
}

export function createObjectStorage(config: Config, client: S3Client = createS3Client(config)): ObjectStorage {
  const bucket = config.s3.bucket;
  return {
    bucket,
    async ensureBucket() {
      try {
        await client.send(new HeadBucketCommand({ Bucket: bucket }));
      } catch {
        await client.send(new CreateBucketCommand({ Bucket: bucket }));
      }
    },
    upload(key, body, contentType) {
      const upload = new Upload({
        client,
        params: { Bucket: bucket, Key: key, Body: body, ContentType: contentType },
        queueSize: 2,
        partSize: 8 * 1024 * 1024,
        leavePartsOnError: false,
      });
      let aborted = false;
      const done = upload.done().then(
        () => undefined,
        (error: unknown) => {
          if (aborted) return;
          throw error;
        },
      );
      return {
        done,
        abort: async () => {
          aborted = true;
          await upload.abort().catch(() => undefined);
          // A small body may already have landed as a single PutObject: remove it too.
          await client.send(new DeleteObjectsCommand({ Bucket: bucket, Delete: { Objects: [{ Key: key }] } })).catch(() => undefined);
        },
      };
    },
    get(key, range) {
      return client.send(new GetObjectCommand({ Bucket: bucket, Key: key, ...(range ? { Range: range } : {}) }));
    },
    async head(key) {
      try {
        const out = await client.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
        return { size: Number(out.ContentLength ?? 0), contentType: out.ContentType };
      } catch (error) {
        if ((error as { name?: string }).name === 'NotFound' || (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
        throw error;
      }
    },
    async remove(keys) {
      const unique = [...new Set(keys.filter(Boolean))];
      for (let i = 0; i < unique.length; i += 1000) {
        await client.send(new DeleteObjectsCommand({ Bucket: bucket, Delete: { Objects: unique.slice(i, i + 1000).map((Key) => ({ Key })), Quiet: true } }));
      }
    },
    async list(prefix) {
      const keys: string[] = [];
      let token: string | undefined;
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix, ContinuationToken: token }));
        for (const item of page.Contents ?? []) if (item.Key) keys.push(item.Key);
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
      return keys;
    },
    destroy() {
      client.destroy();
    },
  };
}
