/**
 * Decides from a file's first bytes whether it can be a video container. Names and the client's
 * Content-Type are never trusted; ffprobe has the last word in the worker.
 * Signatures: ISO BMFF / QuickTime 'ftyp' (and older QuickTime atoms) at offset 4, Matroska/WebM
 * EBML 1A45DFA3, RIFF…AVI, MPEG-TS sync bytes 0x47 every 188 bytes, MPEG-PS pack header 000001BA,
 * FLV. (File-format specifications; common practice.)
 */
export const SNIFF_BYTES = 512;

export type SniffResult = { ok: true; container: string } | { ok: false; reason: string };

const QUICKTIME_ATOMS = new Set(['ftyp', 'moov', 'mdat', 'wide', 'free', 'skip', 'pnot']);

function ascii(buf: Buffer, start: number, end: number): string {
  return buf.subarray(start, end).toString('latin1');
}

export function sniffContainer(head: Buffer): SniffResult {
  if (head.length === 0) return { ok: false, reason: 'the file is empty' };
  if (head.length >= 8 && QUICKTIME_ATOMS.has(ascii(head, 4, 8))) return { ok: true, container: 'mp4' };
  if (head.length >= 4 && head.readUInt32BE(0) === 0x1a45dfa3) return { ok: true, container: 'matroska' };
  if (head.length >= 12 && ascii(head, 0, 4) === 'RIFF' && ascii(head, 8, 12) === 'AVI ') return { ok: true, container: 'avi' };
  if (head.length >= 189 && head[0] === 0x47 && head[188] === 0x47) return { ok: true, container: 'mpegts' };
  if (head.length >= 4 && head.readUInt32BE(0) === 0x000001ba) return { ok: true, container: 'mpegps' };
  if (head.length >= 3 && ascii(head, 0, 3) === 'FLV') return { ok: true, container: 'flv' };
  return { ok: false, reason: `not a video file (${describeOther(head)})` };
}

function describeOther(head: Buffer): string {
  if (head.length >= 8 && head.readUInt32BE(0) === 0x89504e47) return 'it is a PNG image';
  if (head.length >= 3 && head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return 'it is a JPEG image';
  if (ascii(head, 0, 4) === 'GIF8') return 'it is a GIF image';
  if (ascii(head, 0, 4) === '%PDF') return 'it is a PDF document';
  if (ascii(head, 0, 2) === 'PK') return 'it is a ZIP archive';
  if (ascii(head, 0, 3) === 'ID3' || (head[0] === 0xff && ((head[1] ?? 0) & 0xe0) === 0xe0)) return 'it is an audio file';
  if (ascii(head, 0, 4) === 'RIFF' && ascii(head, 8, 12) === 'WAVE') return 'it is an audio file';
  const sample = head.subarray(0, Math.min(head.length, 256));
  const printable = sample.every((b) => b === 9 || b === 10 || b === 13 || (b >= 32 && b < 127) || b >= 0xc2);
  if (printable) return 'it is a text file';
  return 'the content is not a known video container';
}
