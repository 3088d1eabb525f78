import { createHash } from 'node:crypto';
import { realpath } from 'node:fs/promises';
import path from 'node:path';

/**
 * Where an object's bytes live inside a backup. Object keys are server-made (teams/1/clips/2/web.mp4)
 * but a store may hold anything, so a key never becomes a path unchecked: each "/" segment is kept
 * only when it is plainly safe (letters, digits, "_", "-", inner dots; never "." or ".."), otherwise
 * percent-encoded, so no key can climb out of objects/ or name a device. Keys too long or too deep
 * for a file system go to objects/.by-hash/<sha256 of the key>; no safe or encoded segment starts
 * with a dot, so that folder cannot collide with a key. The manifest records every key's file.
 */
export const OBJECTS_DIR = 'objects';
export const BY_HASH_DIR = '.by-hash';
const SAFE_SEGMENT = /^[A-Za-z0-9_-][A-Za-z0-9._-]*$/;
const MAX_SEGMENT_BYTES = 200;
const MAX_SEGMENTS = 32;
const MAX_PATH_BYTES = 1000;

function encodeSegment(segment: string): string {
  // An empty segment (a key like "folder/" or "a//b") becomes a lone "%", which encoding never produces.
  if (segment === '') return '%';
  let out = '';
  for (const byte of Buffer.from(segment, 'utf8')) {
    const ch = String.fromCharCode(byte);
    out += /[A-Za-z0-9_-]/.test(ch) || (ch === '.' && out !== '') ? ch : `%${byte.toString(16).toUpperCase().padStart(2, '0')}`;
  }
  return out;
}

/** The backup-relative path (always with "/") for a key, e.g. objects/teams/1/clips/2/web.mp4. */
export function objectFileFor(key: string): string {
  const segments = key.split('/').map((s) => (SAFE_SEGMENT.test(s) ? s : encodeSegment(s)));
  const relative = segments.join('/');
  const tooBig = segments.length > MAX_SEGMENTS || Buffer.byteLength(relative) > MAX_PATH_BYTES || segments.some((s) => Buffer.byteLength(s) > MAX_SEGMENT_BYTES);
  return tooBig ? hashedObjectFileFor(key) : `${OBJECTS_DIR}/${relative}`;
}

/** The fallback place: used for long keys and when a key's natural path collides with another's. */
export function hashedObjectFileFor(key: string): string {
  return `${OBJECTS_DIR}/${BY_HASH_DIR}/${createHash('sha256').update(key, 'utf8').digest('hex')}`;
}

/**
 * The absolute path of a manifest's `file` entry, refusing anything outside DIR/objects (a manifest
 * is input too: it may have been edited). Symbolic links are resolved first, so a link inside the
 * backup that points at /etc cannot be uploaded into the bucket.
 */
export async function resolveObjectFile(backupDir: string, file: string): Promise<string> {
  if (file.includes('\0') || path.isAbsolute(file) || file.includes('\\')) throw new Error(`object file ${JSON.stringify(file)} is not a relative path`);
  const realDir = await realpath(backupDir);
  const root = await realpath(path.join(realDir, OBJECTS_DIR));
  if (root !== path.join(realDir, OBJECTS_DIR)) throw new Error(`${OBJECTS_DIR}/ in the backup is a link; refusing to read through it`);
  const candidate = path.resolve(realDir, file);
  if (!isInside(root, candidate)) throw new Error(`object file ${JSON.stringify(file)} points outside ${OBJECTS_DIR}/`);
  const real = await realpath(candidate);
  if (!isInside(root, real)) throw new Error(`object file ${JSON.stringify(file)} is a link to outside ${OBJECTS_DIR}/`);
  return real;
}

function isInside(root: string, candidate: string): boolean {
  const relative = path.relative(root, candidate);
  return relative !== '' && relative !== '..' && !relative.startsWith(`..${path.sep}`) && !path.isAbsolute(relative);
}
