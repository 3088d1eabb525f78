import { normaliseProbe, parseRate, parseVideoPackets } from './probe-result';

// Trimmed `ffprobe -print_format json -show_format -show_streams` of the rotated phone fixture (ffmpeg 5.1).
const PHONE = {
  streams: [
    {
      index: 0, codec_name: 'h264', codec_type: 'video', width: 320, height: 180, pix_fmt: 'yuv420p',
      r_frame_rate: '30/1', avg_frame_rate: '30/1', duration: '2.000000', nb_frames: '60',
      disposition: { default: 1, attached_pic: 0 },
      tags: { language: 'und', handler_name: 'VideoHandler' },
      side_data_list: [{ side_data_type: 'Display Matrix', rotation: -90 }],
    },
    { index: 1, codec_name: 'aac', codec_type: 'audio', r_frame_rate: '0/0', avg_frame_rate: '0/0', duration: '1.877000', nb_frames: '89', disposition: { default: 1, attached_pic: 0 } },
  ],
  format: { format_name: 'mov,mp4,m4a,3gp,3g2,mj2', start_time: '0.000000', duration: '2.000000', bit_rate: '792532', tags: { major_brand: 'isom' } },
};

describe('normaliseProbe', () => {
  it('normalises a rotated phone clip', () => {
    expect(normaliseProbe(PHONE)).toEqual({
      formatName: 'mov,mp4,m4a,3gp,3g2,mj2',
      majorBrand: 'isom',
      durationMs: 2000,
      startMs: 0,
      width: 320,
      height: 180,
      displayWidth: 180,
      displayHeight: 320,
      fps: 30,
      frameCount: 60,
      videoCodec: 'h264',
      audioCodec: 'aac',
      pixelFormat: 'yuv420p',
      rotation: 90,
      hasVideo: true,
      hasAudio: true,
      bitRate: 792532,
      moovFirst: null,
    });
  });

  it('turns counter-clockwise display-matrix angles and legacy clockwise tags into clockwise quarter turns', () => {
    const withRotation = (video: Record<string, unknown>) => normaliseProbe({ ...PHONE, streams: [{ ...PHONE.streams[0], side_data_list: undefined, ...video }] }).rotation;
    expect(withRotation({ side_data_list: [{ side_data_type: 'Display Matrix', rotation: 90 }] })).toBe(270);
    expect(withRotation({ side_data_list: [{ side_data_type: 'Display Matrix', rotation: 180 }] })).toBe(180);
    expect(withRotation({ side_data_list: [{ side_data_type: 'Display Matrix', rotation: -180 }] })).toBe(180);
    expect(withRotation({ side_data_list: [{ side_data_type: 'Display Matrix', rotation: -89.9 }] })).toBe(90);
    expect(withRotation({ tags: { rotate: '90' } })).toBe(90);
    expect(withRotation({ tags: { rotate: 'sideways' } })).toBe(0);
    expect(withRotation({})).toBe(0);
  });

  it('ignores cover art: an m4a with a picture is audio only', () => {
    const result = normaliseProbe({
      streams: [
        { codec_type: 'audio', codec_name: 'aac' },
        { codec_type: 'video', codec_name: 'png', width: 64, height: 64, disposition: { attached_pic: 1 } },
      ],
      format: { format_name: 'mov,mp4,m4a,3gp,3g2,mj2', duration: '2.0' },
    });
    expect(result).toMatchObject({ hasVideo: false, hasAudio: true, videoCodec: null, width: 0, fps: 0 });
  });

  it('uses the average rate for variable frame rate, and Matroska without nb_frames', () => {
    const vfr = normaliseProbe({ streams: [{ codec_type: 'video', codec_name: 'h264', width: 320, height: 240, r_frame_rate: '30/1', avg_frame_rate: '600/29' }], format: { format_name: 'mov', duration: '1.933333' } });
    expect(vfr.fps).toBeCloseTo(20.6897, 4);
    expect(vfr.frameCount).toBeNull();
    const mkv = normaliseProbe({ streams: [{ codec_type: 'video', codec_name: 'h264', width: 320, height: 240, r_frame_rate: '30/1', avg_frame_rate: '0/0' }], format: { format_name: 'matroska,webm', duration: '4.023000', start_time: '0.000000' } });
    expect(mkv).toMatchObject({ fps: 30, durationMs: 4023, majorBrand: null, bitRate: null, audioCodec: null, hasAudio: false });
  });

  it('survives junk', () => {
    expect(normaliseProbe(null)).toMatchObject({ hasVideo: false, formatName: '', durationMs: 0 });
    expect(normaliseProbe({ streams: 'x', format: { duration: 'N/A' } })).toMatchObject({ hasVideo: false, durationMs: 0 });
  });

  it('falls back to the stream duration', () => {
    expect(normaliseProbe({ streams: [{ codec_type: 'video', width: 2, height: 2, duration: '1.5' }], format: {} }).durationMs).toBe(1500);
  });
});

describe('parseRate', () => {
  it('reads rationals', () => {
    expect(parseRate('30000/1001')).toBeCloseTo(29.97003, 5);
    expect(parseRate('25')).toBe(25);
    expect(parseRate('0/0')).toBe(0);
    expect(parseRate('1/0')).toBe(0);
    expect(parseRate('abc')).toBe(0);
    expect(parseRate(undefined)).toBe(0);
  });
});

describe('parseVideoPackets', () => {
  it('reads pts, dts and the key flag, shifted to the start of the file', () => {
    expect(parseVideoPackets('1.400000,1.333333,K_\n1.433333,N/A,__\nN/A,1.5,__\n\n', 1.4)).toEqual([
      { pts: 0, dts: expect.closeTo(-0.066667, 6) as unknown as number, key: true },
      { pts: expect.closeTo(0.033333, 6) as unknown as number, dts: expect.closeTo(0.033333, 6) as unknown as number, key: false },
    ]);
  });
});
