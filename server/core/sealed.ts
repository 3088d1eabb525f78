import { createCipheriv, createDecipheriv, createHash, randomBytes } from 'node:crypto';

/**
 * Seals job payloads that carry secrets (mail bodies with one-time links) so the queue's table never
 * holds a raw token: AES-256-GCM with a key derived from SESSION_SECRET, which the API and the worker share.
 */
function keyFrom(secret: string): Buffer {
  return createHash('sha256').update(`trenchwork-job-seal:${secret}`).digest();
}

export function seal(secret: string, value: unknown): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', keyFrom(secret), iv);
  const body = Buffer.concat([cipher.update(JSON.stringify(value), 'utf8'), cipher.final()]);
  return [iv, cipher.getAuthTag(), body].map((b) => b.toString('base64url')).join('.');
}

export function unseal<T>(secret: string, sealed: string): T {
  const [iv, tag, body] = sealed.split('.').map((p) => Buffer.from(p, 'base64url'));
  if (!iv || !tag || !body) throw new Error('Malformed sealed payload');
  const decipher = createDecipheriv('aes-256-gcm', keyFrom(secret), iv);
  decipher.setAuthTag(tag);
  return JSON.parse(Buffer.concat([decipher.update(body), decipher.final()]).toString('utf8')) as T;
}
