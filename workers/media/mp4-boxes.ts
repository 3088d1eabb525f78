/**
 * Reads the top-level box list of an MP4/QuickTime file (ISO/IEC 14496-12 §4.2: 32-bit size and
 * 4-char type; size 1 = 64-bit size follows, size 0 = to the end of the file). Tells whether moov
 * comes before mdat (faststart) and whether the file was cut short: a box that claims more bytes
 * than the file has. Reads only box headers, a few bytes per box.
 */
import { open } from 'node:fs/promises';

export interface TopLevelBox {
  type: string;
  offset: number;
  size: number;
}

export interface BoxLayout {
  /** The file starts with a known MP4/QuickTime box. */
  isMp4: boolean;
  boxes: TopLevelBox[];
  /** A box runs past the end of the file, or the file ends inside a box header. */
  truncated: boolean;
  /** null when the file has no moov or no mdat. */
  moovFirst: boolean | null;
}

const FIRST_BOX_TYPES = new Set(['ftyp', 'moov', 'mdat', 'wide', 'free', 'skip', 'pnot', 'styp']);
const MAX_BOXES = 10_000;

/** Pure: the layout from a header reader (offset → up to 16 bytes), given the file size. */
export async function scanBoxes(readAt: (offset: number, length: number) => Promise<Buffer>, fileSize: number): Promise<BoxLayout> {
  const boxes: TopLevelBox[] = [];
  let offset = 0;
  let truncated = false;
  while (offset < fileSize && boxes.length < MAX_BOXES) {
    const header = await readAt(offset, 16);
    if (header.length < 8) {
      truncated = true;
      break;
    }
    const type = header.toString('latin1', 4, 8);
    if (boxes.length === 0 && !FIRST_BOX_TYPES.has(type)) return { isMp4: false, boxes: [], truncated: false, moovFirst: null };
    let size = header.readUInt32BE(0);
    if (size === 1) {
      if (header.length < 16) {
        truncated = true;
        break;
      }
      size = Number(header.readBigUInt64BE(8));
    } else if (size === 0) {
      size = fileSize - offset;
    }
    if (size < 8) {
      truncated = true; // a zero or negative-length box: the rest is not a box list
      break;
    }
    boxes.push({ type, offset, size });
    if (offset + size > fileSize) {
      truncated = true;
      break;
    }
    offset += size;
  }
  if (boxes.length === 0) return { isMp4: false, boxes, truncated: false, moovFirst: null };
  const moov = boxes.findIndex((b) => b.type === 'moov');
  const mdat = boxes.findIndex((b) => b.type === 'mdat');
  return { isMp4: true, boxes, truncated, moovFirst: moov >= 0 && mdat >= 0 ? moov < mdat : null };
}

export async function readBoxLayout(path: string): Promise<BoxLayout> {
  const handle = await open(path, 'r');
  try {
    const { size } = await handle.stat();
    return await scanBoxes(async (offset, length) => {
      const buffer = Buffer.alloc(length);
      const { bytesRead } = await handle.read(buffer, 0, length, offset);
      return buffer.subarray(0, bytesRead);
    }, size);
  } finally {
    await handle.close();
  }
}
