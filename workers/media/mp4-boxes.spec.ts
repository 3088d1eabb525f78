import { scanBoxes } from './mp4-boxes';

function box(type: string, payload: number): Buffer {
  const b = Buffer.alloc(8 + payload);
  b.writeUInt32BE(8 + payload, 0);
  b.write(type, 4, 'latin1');
  return b;
}

function largeBox(type: string, declaredSize: bigint, actualPayload: number): Buffer {
  const b = Buffer.alloc(16 + actualPayload);
  b.writeUInt32BE(1, 0);
  b.write(type, 4, 'latin1');
  b.writeBigUInt64BE(declaredSize, 8);
  return b;
}

const scan = (file: Buffer) => scanBoxes(async (offset, length) => file.subarray(offset, offset + length), file.length);

describe('scanBoxes', () => {
  it('sees moov before mdat in a faststart file', async () => {
    const layout = await scan(Buffer.concat([box('ftyp', 24), box('moov', 100), box('mdat', 1000)]));
    expect(layout).toEqual({
      isMp4: true,
      truncated: false,
      moovFirst: true,
      boxes: [
        { type: 'ftyp', offset: 0, size: 32 },
        { type: 'moov', offset: 32, size: 108 },
        { type: 'mdat', offset: 140, size: 1008 },
      ],
    });
  });

  it('sees moov at the end', async () => {
    expect(await scan(Buffer.concat([box('ftyp', 24), box('free', 0), box('mdat', 1000), box('moov', 100)]))).toMatchObject({ moovFirst: false, truncated: false });
  });

  it('reads 64-bit sizes', async () => {
    const mdat = largeBox('mdat', 16n + 50n, 50);
    expect(await scan(Buffer.concat([box('ftyp', 8), mdat, box('moov', 10)]))).toMatchObject({ moovFirst: false, truncated: false });
  });

  it('finds a cut-short file: a box longer than what is left, or a header cut in half', async () => {
    const whole = Buffer.concat([box('ftyp', 24), box('mdat', 1000), box('moov', 100)]);
    expect(await scan(whole.subarray(0, 300))).toMatchObject({ isMp4: true, truncated: true, moovFirst: null });
    expect(await scan(whole.subarray(0, 36))).toMatchObject({ isMp4: true, truncated: true });
    expect(await scan(Buffer.concat([box('ftyp', 8), largeBox('mdat', 10_000n, 10)]))).toMatchObject({ truncated: true });
  });

  it('treats size 0 as "to the end of the file"', async () => {
    const open = box('mdat', 40);
    open.writeUInt32BE(0, 0);
    expect(await scan(Buffer.concat([box('ftyp', 8), box('moov', 8), open]))).toMatchObject({ truncated: false, moovFirst: true });
  });

  it('says "not MP4" for other files', async () => {
    expect(await scan(Buffer.from('Ironvale Anvils practice notes\n'))).toEqual({ isMp4: false, boxes: [], truncated: false, moovFirst: null });
    expect(await scan(Buffer.from([0x1a, 0x45, 0xdf, 0xa3, 0, 0, 0, 0, 0, 0]))).toMatchObject({ isMp4: false });
    expect(await scan(Buffer.alloc(0))).toMatchObject({ isMp4: false });
  });
});
