import {
  ALLOWED_DEMUXERS,
  checkNumber,
  chooseCutMode,
  choosePosterSeconds,
  copyReadSeconds,
  cutCommand,
  decodeCheckCommand,
  fitWidth,
  formatSeconds,
  globalOptions,
  inputGuards,
  keyframeTimes,
  locateDamageCommand,
  nearestKeyframe,
  parseSceneTimes,
  posterCommand,
  probeArgs,
  renditionCommand,
  renditionPlan,
  sceneDetectCommand,
  scaledEvenHeight,
  stripCommand,
  toArgs,
  videoPacketsArgs,
} from './ffmpeg-commands';
import { parseVideoPackets } from './probe-result';

const MP4 = 'mov,mp4,m4a,3gp,3g2,mj2';
const MKV = 'matroska,webm';
const WHITELIST = ALLOWED_DEMUXERS.join(',');
const GLOBAL = ['-nostdin', '-hide_banner', '-y', '-loglevel', 'error', '-stats', '-stats_period', '0.1', '-xerror'];
const MP4_GUARDS = ['-protocol_whitelist', 'file', '-format_whitelist', WHITELIST, '-enable_drefs', '0', '-use_absolute_path', '0'];
const MKV_GUARDS = ['-protocol_whitelist', 'file', '-format_whitelist', WHITELIST];

describe('guards', () => {
  it('adds the MP4 reference options only for the MOV/MP4 demuxer', () => {
    expect(inputGuards(MP4)).toEqual(MP4_GUARDS);
    expect(inputGuards(MKV)).toEqual(MKV_GUARDS);
    expect(inputGuards('avi')).toEqual(MKV_GUARDS);
  });

  it('never lets playlist or image demuxers in', () => {
    for (const name of ['hls', 'concat', 'image2', 'png_pipe', 'tty', 'lavfi', 'data']) expect(WHITELIST.split(',')).not.toContain(name);
  });

  it('is strict (-xerror) unless told otherwise', () => {
    expect(globalOptions()).toEqual(GLOBAL);
    expect(globalOptions({ strict: false })).toEqual(GLOBAL.slice(0, -1));
    expect(globalOptions({ logLevel: 'info' })).toContain('info');
  });

  it('turns paths into file: URLs and refuses relative paths and NUL bytes', () => {
    expect(probeArgs('/tmp/job/http:evil.mp4').at(-1)).toBe('file:/tmp/job/http:evil.mp4');
    expect(() => probeArgs('clip.mp4')).toThrow(RangeError);
    expect(() => probeArgs('-i')).toThrow(RangeError);
    expect(() => probeArgs('/tmp/a\0b')).toThrow(RangeError);
  });
});

describe('ffprobe arguments', () => {
  it('probe: JSON, guarded, no shell', () => {
    expect(probeArgs('/tmp/job/original')).toEqual([...MP4_GUARDS, '-v', 'error', '-hide_banner', '-print_format', 'json', '-show_format', '-show_streams', 'file:/tmp/job/original']);
  });

  it('packets of the first video stream', () => {
    expect(videoPacketsArgs('/tmp/job/tape.mp4')).toEqual([
      ...MP4_GUARDS, '-v', 'error', '-hide_banner',
      '-select_streams', 'v:0', '-show_entries', 'packet=pts_time,dts_time,flags', '-of', 'csv=p=0', 'file:/tmp/job/tape.mp4',
    ]);
  });
});

describe('posterCommand', () => {
  it('seeks before -i, takes one frame, scales to at most maxWidth with even sizes', () => {
    const command = posterCommand({ input: '/tmp/job/original', inputFormat: MP4, output: '/tmp/job/poster.jpg', atSeconds: 2.5, maxWidth: 1280 });
    expect(command).toEqual({
      globalOptions: GLOBAL,
      inputs: [{ options: [...MP4_GUARDS, '-ss', '2.5'], url: 'file:/tmp/job/original' }],
      outputOptions: ['-map', '0:v:0', '-an', '-sn', '-dn', '-frames:v', '1', '-vf', "scale='trunc(min(iw,1280)/2)*2':-2", '-q:v', '3', '-f', 'image2', '-update', '1'],
      output: 'file:/tmp/job/poster.jpg',
      durationSeconds: null,
    });
    expect(toArgs(command).slice(GLOBAL.length + MP4_GUARDS.length)).toEqual(['-ss', '2.5', '-i', 'file:/tmp/job/original', ...command.outputOptions, 'file:/tmp/job/poster.jpg']);
  });

  it('refuses bad numbers before they reach a filter graph', () => {
    const base = { input: '/tmp/a.mp4', inputFormat: MP4, output: '/tmp/p.jpg', atSeconds: 1, maxWidth: 640 };
    expect(() => posterCommand({ ...base, atSeconds: Number.NaN })).toThrow(RangeError);
    expect(() => posterCommand({ ...base, atSeconds: -1 })).toThrow(RangeError);
    expect(() => posterCommand({ ...base, atSeconds: Number.POSITIVE_INFINITY })).toThrow(RangeError);
    expect(() => posterCommand({ ...base, maxWidth: 640.5 })).toThrow(RangeError);
    expect(() => posterCommand({ ...base, maxWidth: '640,drawtext=text=x' as unknown as number })).toThrow(RangeError);
  });

  it('picks a third of the way in, capped at a minute; the middle of short clips; 0 for very short', () => {
    expect(choosePosterSeconds(9)).toBe(3);
    expect(choosePosterSeconds(3600)).toBe(60);
    expect(choosePosterSeconds(2)).toBe(1);
    expect(choosePosterSeconds(0.034)).toBe(0);
    expect(choosePosterSeconds(Number.NaN)).toBe(0);
  });

  it('predicts the size ffmpeg gives', () => {
    expect(fitWidth({ width: 3840, height: 2160 }, 1280)).toEqual({ width: 1280, height: 720 });
    expect(fitWidth({ width: 321, height: 241 }, 1280)).toEqual({ width: 320, height: 240 });
    expect(fitWidth({ width: 180, height: 320 }, 1280)).toEqual({ width: 180, height: 320 });
    // 160 × 320 / 180 = 284.4 → 284; 160 × 240 / 320 = 120
    expect(scaledEvenHeight(160, { width: 180, height: 320 })).toBe(284);
    expect(scaledEvenHeight(160, { width: 320, height: 240 })).toBe(120);
  });
});

describe('stripCommand', () => {
  it('samples N frames evenly into one row and returns the layout', () => {
    const { command, layout } = stripCommand({
      input: '/tmp/job/original', inputFormat: MKV, output: '/tmp/job/strip.jpg',
      durationSeconds: 12.345, frames: 10, tileWidth: 160, display: { width: 1920, height: 1080 },
    });
    expect(command).toEqual({
      globalOptions: GLOBAL,
      inputs: [{ options: MKV_GUARDS, url: 'file:/tmp/job/original' }],
      outputOptions: ['-map', '0:v:0', '-an', '-sn', '-dn', '-vf', 'fps=10/12.345,scale=160:-2,tile=10x1', '-frames:v', '1', '-q:v', '5', '-f', 'image2', '-update', '1'],
      output: 'file:/tmp/job/strip.jpg',
      durationSeconds: 12.345,
    });
    expect(layout).toEqual({ frames: 10, columns: 10, rows: 1, intervalMs: 1234.5, tileWidth: 160, tileHeight: 90 });
  });

  it('rejects zero duration, odd tile width and absurd frame counts', () => {
    const base = { input: '/tmp/a', inputFormat: MP4, output: '/tmp/s.jpg', durationSeconds: 5, frames: 10, tileWidth: 160, display: { width: 320, height: 240 } };
    expect(() => stripCommand({ ...base, durationSeconds: 0 })).toThrow(RangeError);
    expect(() => stripCommand({ ...base, tileWidth: 161 })).toThrow(RangeError);
    expect(() => stripCommand({ ...base, frames: 0 })).toThrow(RangeError);
    expect(() => stripCommand({ ...base, frames: 1000 })).toThrow(RangeError);
    expect(() => stripCommand({ ...base, display: { width: 0, height: 240 } })).toThrow(RangeError);
  });
});

describe('renditionPlan', () => {
  const ready = {
    formatName: MP4, majorBrand: 'isom', videoCodec: 'h264', audioCodec: 'aac', pixelFormat: 'yuv420p',
    displayHeight: 720, hasVideo: true, moovFirst: true,
  };
  const plan = (over: Partial<typeof ready> | Record<string, unknown>) => renditionPlan({ ...ready, ...over } as typeof ready, { maxHeight: 720 }).action;

  it('skips a web-ready MP4', () => expect(renditionPlan(ready, { maxHeight: 720 })).toEqual({ action: 'skip', reason: 'already a web-playable MP4' }));
  it('skips a silent one too', () => expect(plan({ audioCodec: null })).toBe('skip'));
  it('remuxes when moov is at the end or unknown', () => {
    expect(plan({ moovFirst: false })).toBe('remux');
    expect(plan({ moovFirst: null })).toBe('remux');
  });
  it('remuxes web codecs from Matroska and QuickTime', () => {
    expect(plan({ formatName: MKV, majorBrand: null, moovFirst: null })).toBe('remux');
    expect(plan({ majorBrand: 'qt  ' })).toBe('remux');
  });
  it('transcodes other codecs, pixel formats, audio and sizes', () => {
    expect(plan({ videoCodec: 'hevc' })).toBe('transcode');
    expect(plan({ videoCodec: 'mpeg4' })).toBe('transcode');
    expect(plan({ pixelFormat: 'yuv422p' })).toBe('transcode');
    expect(plan({ pixelFormat: 'yuv420p10le' })).toBe('transcode');
    expect(plan({ audioCodec: 'mp3' })).toBe('transcode');
    expect(plan({ displayHeight: 1080 })).toBe('transcode');
    expect(plan({ displayHeight: 1080, formatName: MKV })).toBe('transcode');
  });
  it('needs video', () => expect(() => plan({ hasVideo: false })).toThrow(RangeError));
});

describe('renditionCommand', () => {
  const base = { input: '/tmp/job/original', inputFormat: MP4, output: '/tmp/job/web.mp4', durationSeconds: 8 };

  it('transcodes to H.264/AAC, at most 720 high, never upscaled, moov first, no metadata', () => {
    const command = renditionCommand({ ...base, plan: { action: 'transcode', reason: 'x' } });
    expect(command.inputs).toEqual([{ options: MP4_GUARDS, url: 'file:/tmp/job/original' }]);
    expect(command.outputOptions).toEqual([
      '-map', '0:v:0', '-map', '0:a:0?', '-sn', '-dn', '-map_metadata', '-1', '-map_chapters', '-1',
      '-vf', "scale=-2:'trunc(min(ih,720)/2)*2'",
      '-c:v', 'libx264', '-preset', 'veryfast', '-crf', '23', '-pix_fmt', 'yuv420p', '-c:a', 'aac',
      '-movflags', '+faststart', '-f', 'mp4',
    ]);
    expect(command.durationSeconds).toBe(8);
    expect(renditionCommand({ ...base, plan: { action: 'transcode', reason: 'x' }, maxHeight: 480 }).outputOptions).toContain("scale=-2:'trunc(min(ih,480)/2)*2'");
  });

  it('remuxes with stream copy', () => {
    expect(renditionCommand({ ...base, inputFormat: MKV, plan: { action: 'remux', reason: 'x' } }).outputOptions).toEqual([
      '-map', '0:v:0', '-map', '0:a:0?', '-sn', '-dn', '-map_metadata', '-1', '-map_chapters', '-1', '-c', 'copy', '-movflags', '+faststart', '-f', 'mp4',
    ]);
  });

  it('has nothing to run for skip, and refuses odd heights', () => {
    expect(() => renditionCommand({ ...base, plan: { action: 'skip', reason: 'x' } })).toThrow(RangeError);
    expect(() => renditionCommand({ ...base, plan: { action: 'transcode', reason: 'x' }, maxHeight: -720 })).toThrow(RangeError);
  });

  it('decode check and damage locator write nothing', () => {
    expect(decodeCheckCommand({ input: '/tmp/a', inputFormat: MKV })).toEqual({
      globalOptions: GLOBAL,
      inputs: [{ options: MKV_GUARDS, url: 'file:/tmp/a' }],
      outputOptions: ['-map', '0:v:0', '-map', '0:a:0?', '-sn', '-dn', '-f', 'null'],
      output: '-',
      durationSeconds: null,
    });
    expect(locateDamageCommand({ input: '/tmp/a', inputFormat: MKV }).outputOptions).toContain("select='isnan(prev_selected_t)+gte(t-prev_selected_t,0.5)',showinfo");
  });
});

describe('scene detection', () => {
  it('builds select + showinfo to the null muxer at the info log level', () => {
    expect(sceneDetectCommand({ input: '/tmp/t.mp4', inputFormat: MP4, threshold: 0.3, durationSeconds: 8 })).toEqual({
      globalOptions: ['-nostdin', '-hide_banner', '-y', '-loglevel', 'info', '-stats', '-stats_period', '0.1', '-xerror'],
      inputs: [{ options: MP4_GUARDS, url: 'file:/tmp/t.mp4' }],
      outputOptions: ['-map', '0:v:0', '-an', '-sn', '-dn', '-vf', "select='gt(scene,0.3)',showinfo", '-f', 'null'],
      output: '-',
      durationSeconds: 8,
    });
  });

  it('takes only a number between 0 and 1 as threshold', () => {
    const base = { input: '/tmp/t.mp4', inputFormat: MP4 };
    for (const bad of [0, 1, -0.2, Number.NaN, '0.3)+1' as unknown as number]) expect(() => sceneDetectCommand({ ...base, threshold: bad })).toThrow(RangeError);
  });

  // Captured from ffmpeg 5.1 on a five-segment test tape; note the progress line sharing a line with showinfo.
  const STDERR = [
    'Input #0, mov,mp4,m4a,3gp,3g2,mj2, from \'file:/tmp/mx/tape.mp4\':',
    '[Parsed_showinfo_1 @ 0x55d9a25b9780] config in time_base: 1/15360, frame_rate: 30/1',
    '[Parsed_showinfo_1 @ 0x55d9a25b9780] config out time_base: 0/0, frame_rate: 0/0',
    '[Parsed_showinfo_1 @ 0x55d9a25b9780] n:   0 pts:  23040 pts_time:1.5     pos:    66279 fmt:yuv420p sar:1/1 s:320x240 i:P iskey:1 type:I checksum:B18D2863 plane_checksum:[707BF1C8 E66CF115 92604568] mean:[96 133 127] stdev:[62.0 47.9 50.3]',
    '[Parsed_showinfo_1 @ 0x55d9a25b9780] color_range:unknown color_space:unknown color_primaries:unknown color_trc:unknown',
    'frame=    1 fps=0.0 q=-0.0 size=N/A time=00:00:01.53 bitrate=N/A speed=51.9x    \r[Parsed_showinfo_1 @ 0x55d9a25b9780] n:   1 pts:  56832 pts_time:3.7     pos:    87783 fmt:yuv420p sar:1/1 s:320x240 i:P iskey:1 type:I',
    '[Parsed_showinfo_1 @ 0x55d9a25b9780] n:   2 pts:  72192 pts_time:4.7     pos:   150886 fmt:yuv420p sar:1/1 s:320x240 i:P iskey:1 type:I',
    '[Parsed_showinfo_1 @ 0x55d9a25b9780] n:   3 pts: 102912 pts_time:6.7     pos:   250886 fmt:yuv420p sar:1/1 s:320x240 i:P iskey:1 type:I',
  ].join('\n');

  it('reads exact times from pts × time base', () => {
    expect(parseSceneTimes(STDERR)).toEqual([1.5, 3.7, 4.7, 6.7]);
  });

  it('falls back to pts_time without the config line, and finds nothing in a clean run', () => {
    const withoutBase = STDERR.split('\n').filter((l) => !l.includes('config in')).join('\n');
    expect(parseSceneTimes(withoutBase)).toEqual([1.5, 3.7, 4.7, 6.7]);
    expect(parseSceneTimes('frame=  240 fps=0.0 q=-0.0 Lsize=N/A time=00:00:08.00 bitrate=N/A speed=41x')).toEqual([]);
  });

  it('beats the six-digit pts_time two hours in', () => {
    const late = '[Parsed_showinfo_1 @ 0x1] config in time_base: 1/90000, frame_rate: 30000/1001\n[Parsed_showinfo_1 @ 0x1] n:   0 pts: 648003003 pts_time:7200.03 pos: 1';
    expect(parseSceneTimes(late)[0]).toBeCloseTo(7200.0333667, 6);
  });
});

describe('cuts', () => {
  // Captured: `ffprobe -show_entries packet=pts_time,dts_time,flags -of csv=p=0` around the 4.7 s cut
  // of a B-frame H.264 tape (decode order).
  const PACKETS = parseVideoPackets(
    ['4.633333,4.466667,__', '4.566667,4.500000,__', '4.600000,4.566667,__', '4.666667,4.600000,__', '4.700000,4.633333,K_', '4.766667,4.700000,__', '4.733333,4.733333,__', '4.800000,4.766667,__'].join('\n'),
  );
  const keyframes = [0, 1.5, 3.5, 3.7, 4.7, 6.7];

  it('copy only when every cut is within half a frame of a keyframe', () => {
    expect(chooseCutMode([1.5, 3.7, 4.7], keyframes, 30)).toBe('copy');
    expect(chooseCutMode([1.51, 3.7], keyframes, 30)).toBe('copy'); // 10 ms < 16.7 ms
    expect(chooseCutMode([1.52, 3.7], keyframes, 30)).toBe('encode'); // 20 ms > 16.7 ms
    expect(chooseCutMode([2.5], keyframes, 30)).toBe('encode');
    expect(chooseCutMode([], keyframes, 30)).toBe('copy');
    expect(chooseCutMode([1.519], keyframes, 25)).toBe('copy'); // 19 ms: half a frame is 20 ms at 25 fps
    expect(() => chooseCutMode([1.5], keyframes, 0)).toThrow(RangeError);
    expect(() => chooseCutMode([Number.NaN], keyframes, 30)).toThrow(RangeError);
  });

  it('finds the nearest keyframe either side', () => {
    expect(nearestKeyframe(3.69, keyframes, 30)).toBe(3.7);
    expect(nearestKeyframe(3.71, keyframes, 30)).toBe(3.7);
    expect(nearestKeyframe(3.6, keyframes, 30)).toBeUndefined();
    expect(keyframeTimes(PACKETS)).toEqual([4.7]);
  });

  it('limits copied video by decode time, midway before the next keyframe is decoded', () => {
    // Shown before 4.7: last dts 4.6; the 4.7 keyframe decodes at 4.633 → limit 4.6167 − start 3.7.
    const read = copyReadSeconds(PACKETS, 3.7, 4.7, 30);
    expect(read?.frames).toBe(4);
    expect(read?.seconds).toBeCloseTo(0.916667, 5);
  });

  it('gives up on copy when frames shown later decode earlier (open GOP)', () => {
    const open = parseVideoPackets('1.000000,0.900000,K_\n0.966667,0.933333,__\n1.033333,0.966667,__');
    expect(copyReadSeconds(open, 0, 1, 30)).toBeNull();
  });

  const cutBase = { input: '/tmp/job/tape.mp4', inputFormat: MP4, output: '/tmp/job/snap.mp4', fps: 30 };

  it('encode: a quarter frame early on both ends, web format', () => {
    const command = cutCommand({ ...cutBase, startSeconds: 3.7, endSeconds: 4.7, mode: 'encode' });
    expect(command.inputs).toEqual([{ options: [...MP4_GUARDS, '-ss', formatSeconds(3.7 - 0.25 / 30)], url: 'file:/tmp/job/tape.mp4' }]);
    expect(command.inputs[0]!.options.at(-1)).toBe('3.691667');
    expect(command.outputOptions).toEqual([
      '-t', '1', '-map', '0:v:0', '-map', '0:a:0?', '-sn', '-dn', '-map_metadata', '-1', '-map_chapters', '-1',
      '-vf', "scale=-2:'trunc(min(ih,720)/2)*2'",
      '-c:v', 'libx264', '-preset', 'veryfast', '-crf', '23', '-pix_fmt', 'yuv420p', '-c:a', 'aac', '-movflags', '+faststart', '-f', 'mp4',
    ]);
    expect(command.durationSeconds).toBe(1);
    expect(cutCommand({ ...cutBase, startSeconds: 3.7, endSeconds: 4.7, mode: 'encode', maxHeight: 480 }).outputOptions).toContain("scale=-2:'trunc(min(ih,480)/2)*2'");
  });

  it('copy: video copied from one read of the file, audio trimmed from another', () => {
    const command = cutCommand({ ...cutBase, startSeconds: 3.7, endSeconds: 4.7, mode: 'copy', copyVideoSeconds: 0.916667 });
    expect(command.inputs).toEqual([
      { options: [...MP4_GUARDS, '-ss', '3.7', '-t', '0.916667'], url: 'file:/tmp/job/tape.mp4' },
      { options: [...MP4_GUARDS, '-ss', '3.7', '-t', '1'], url: 'file:/tmp/job/tape.mp4' },
    ]);
    expect(command.outputOptions).toEqual([
      '-map', '0:v:0', '-map', '1:a:0?', '-sn', '-dn', '-map_metadata', '-1', '-map_chapters', '-1', '-c:v', 'copy', '-c:a', 'aac', '-movflags', '+faststart', '-f', 'mp4',
    ]);
  });

  it('refuses reversed or unknown ranges', () => {
    expect(() => cutCommand({ ...cutBase, startSeconds: 5, endSeconds: 4, mode: 'encode' })).toThrow(RangeError);
    expect(() => cutCommand({ ...cutBase, startSeconds: -1, endSeconds: 4, mode: 'encode' })).toThrow(RangeError);
    expect(() => cutCommand({ ...cutBase, startSeconds: 1, endSeconds: 4, mode: 'copy' })).toThrow(RangeError);
    expect(() => cutCommand({ ...cutBase, startSeconds: 1, endSeconds: 4, mode: 'encode', fps: Number.NaN })).toThrow(RangeError);
  });
});

describe('numbers', () => {
  it('prints plain decimals with microsecond precision', () => {
    expect(formatSeconds(1 / 3)).toBe('0.333333');
    expect(formatSeconds(1e-7)).toBe('0');
    expect(formatSeconds(7200)).toBe('7200');
    expect(formatSeconds(0.1 + 0.2)).toBe('0.3');
  });

  it('checks limits', () => {
    expect(checkNumber('x', 3, { integer: true, max: 3 })).toBe(3);
    expect(() => checkNumber('x', 3.5, { integer: true })).toThrow('x must be an integer');
    expect(() => checkNumber('x', 0, { above: 0 })).toThrow('x must be above 0');
    expect(() => checkNumber('x', 11, { max: 10 })).toThrow('x must be at most 10');
  });
});
