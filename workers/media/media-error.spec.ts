import { MediaError, classifyFailure, formatLimit, formatMediaTime, lastProgressSeconds, mediaErrorFromStderr } from './media-error';

// Every sample is stderr captured from Debian's ffmpeg/ffprobe 5.1 on the bad files of
// test/support/media-fixtures.ts, with the options ffmpeg-commands.ts passes.
const SAMPLES = {
  pngAsMp4: "[png_pipe @ 0x560bd687d300] Format not on whitelist 'mov,matroska,avi,mpegts,mpeg,asf,mp3,wav,ogg,flac,aac'\nfile:/tmp/j/picture.mp4: Invalid argument",
  hls: "[hls @ 0x5585c8f66300] Format not on whitelist 'mov,matroska,avi,mpegts,mpeg,asf,mp3,wav,ogg,flac,aac'\nfile:/tmp/j/playlist.mp4: Invalid argument",
  textAsMp4: '[mov,mp4,m4a,3gp,3g2,mj2 @ 0x5652d5890300] moov atom not found\nfile:/tmp/j/notes.mp4: Invalid data found when processing input',
  noName: 'file:/tmp/j/original: Invalid data found when processing input',
  noVideoStream: "Stream map '0:v:0' matches no streams.\nTo ignore this, add a trailing '?' to the map.",
  aacDamage: 'frame=    1 fps=0.0 q=-0.0 size=N/A time=00:00:00.06 bitrate=N/A speed=7.28x    \n[aac @ 0x55c7a3cfa600] channel element 3.0 is not allocated',
  h264Damage: 'frame=   83 fps=0.0 q=-0.0 size=N/A time=00:00:12.83 bitrate=N/A speed=  21x    \n[h264 @ 0x55890ae75400] error while decoding MB 32 20, bytestream -26',
  decodeError: 'Error while decoding stream #0:0: Invalid data found when processing input',
  parserDamage: 'frame=    1 fps=0.0 q=-0.0 size=N/A time=00:00:00.06 bitrate=N/A speed=12.4x    \n[NULL @ 0x56388c7c3100] Invalid NAL unit size (4431 > 2467).\n[NULL @ 0x56388c7c3100] missing picture in access unit with size 2471\nfile:/tmp/j/t.mp4: corrupt input packet in stream 0',
  partialFile: '[mov,mp4,m4a,3gp,3g2,mj2 @ 0x5589ac8ee980] stream 1, offset 0x2c733: partial file',
  unknown: 'Option enable_drefs not found.',
};

describe('classifyFailure', () => {
  it('names files ffmpeg refuses to open', () => {
    expect(classifyFailure(SAMPLES.pngAsMp4).code).toBe('not_video');
    expect(classifyFailure(SAMPLES.hls).code).toBe('not_video');
    expect(classifyFailure(SAMPLES.noName)).toEqual({ code: 'not_video', reason: 'not a video file' });
  });

  it('tells a cut-short MP4 from a text file ffmpeg took for one by its name', () => {
    expect(classifyFailure(SAMPLES.textAsMp4)).toEqual({ code: 'not_video', reason: 'not a video file' });
    expect(classifyFailure(SAMPLES.textAsMp4, { looksLikeMp4: true })).toEqual({ code: 'truncated', reason: 'the file is cut short (truncated)' });
    expect(classifyFailure(SAMPLES.partialFile).code).toBe('truncated');
  });

  it('says where the stream became unreadable', () => {
    expect(classifyFailure(SAMPLES.h264Damage)).toEqual({ code: 'damaged', reason: 'stream unreadable near 0:12' });
    expect(classifyFailure(SAMPLES.aacDamage)).toEqual({ code: 'damaged', reason: 'stream unreadable near 0:00' });
    expect(classifyFailure(SAMPLES.aacDamage, { nearSeconds: 75.4 }).reason).toBe('stream unreadable near 1:15');
    expect(classifyFailure(SAMPLES.decodeError).code).toBe('damaged');
    expect(classifyFailure(SAMPLES.parserDamage).code).toBe('damaged');
  });

  it('names a file without pictures', () => {
    expect(classifyFailure(SAMPLES.noVideoStream)).toEqual({ code: 'audio_only', reason: 'the file has no video stream (audio only)' });
  });

  it('falls back to a general reason', () => {
    expect(classifyFailure(SAMPLES.unknown)).toEqual({ code: 'failed', reason: 'the video could not be processed' });
    expect(classifyFailure('')).toEqual({ code: 'failed', reason: 'the video could not be processed' });
  });
});

describe('MediaError', () => {
  it('carries the reason, a log excerpt without progress lines, and whether to retry', () => {
    const error = mediaErrorFromStderr(SAMPLES.h264Damage);
    expect(error).toBeInstanceOf(MediaError);
    expect(error.message).toBe('stream unreadable near 0:12');
    expect(error.detail).toBe('[h264 @ 0x55890ae75400] error while decoding MB 32 20, bytestream -26');
    expect(error.permanent).toBe(true);
    expect(new MediaError('tool_missing', 'x').permanent).toBe(false);
  });

  it('words the time limit as configured', () => {
    expect(MediaError.timeout(300_000).reason).toBe('processing took longer than 5 min');
    expect(MediaError.timeout(90_000).reason).toBe('processing took longer than 90 s');
    expect(formatLimit(1500)).toBe('1.5 s');
    expect(formatLimit(150)).toBe('150 ms');
  });
});

describe('times', () => {
  it('reads the last progress mark', () => {
    expect(lastProgressSeconds('time=00:00:01.50 x\rtime=01:02:03.25 y')).toBe(3723.25);
    expect(lastProgressSeconds('time=-00:00:00.02')).toBe(0);
    expect(lastProgressSeconds('no progress')).toBeUndefined();
  });

  it('prints m:ss, and h:mm:ss past an hour', () => {
    expect(formatMediaTime(12.9)).toBe('0:12');
    expect(formatMediaTime(75)).toBe('1:15');
    expect(formatMediaTime(3723.25)).toBe('1:02:03');
    expect(formatMediaTime(-3)).toBe('0:00');
    expect(formatMediaTime(Number.NaN)).toBe('0:00');
  });
});
