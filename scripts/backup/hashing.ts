import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { Transform, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';

/** A pass-through that hashes (SHA-256) and counts what flows through it. */
export class HashingPassThrough extends Transform {
  private readonly hash = createHash('sha256');
  bytes = 0;

  override _transform(chunk: Buffer, _encoding: BufferEncoding, callback: (error?: Error | null, data?: Buffer) => void): void {
    this.hash.update(chunk);
    this.bytes += chunk.length;
    callback(null, chunk);
  }

  digest(): string {
    return this.hash.digest('hex');
  }
}

/** SHA-256 and size of a stream, read to the end. */
export async function hashStream(stream: Readable): Promise<{ sha256: string; bytes: number }> {
  const hasher = new HashingPassThrough();
  await pipeline(stream, hasher, async function* (source) {
    for await (const _chunk of source) {
      // Consumed only for the hash.
    }
  });
  return { sha256: hasher.digest(), bytes: hasher.bytes };
}

export function hashFile(file: string): Promise<{ sha256: string; bytes: number }> {
  return hashStream(createReadStream(file));
}
