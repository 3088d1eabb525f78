/**
 * ffprobe's JSON, normalised into the few facts the product decides by. Pure: unit-tested on
 * captured ffprobe output, and the integration suite checks it against plain `ffprobe` on real files.
 */
export interface ProbeResult {
  /** ffprobe's format_name, e.g. "mov,mp4,m4a,3gp,3g2,mj2" or "matroska,webm". */
  formatName: string;
  /** MP4 major brand ("isom", "qt  "…) or null when the container has none. */
  majorBrand: string | null;
  durationMs: number;
  /** The container's first timestamp; ffmpeg's -ss and filter times count from here. */
  startMs: number;
  /** Coded size of the first video stream (0 when there is none). */
  width: number;
  height: number;
  /** Size as shown, after the rotation is applied. */
  displayWidth: number;
  displayHeight: number;
  /** Frames per second from avg_frame_rate, else r_frame_rate; 0 when unknown. */
  fps: number;
  /** Frames in the video stream when the container says (MP4 does), else null. */
  frameCount: number | null;
  videoCodec: string | null;
  audioCodec: string | null;
  pixelFormat: string | null;
  /** Clockwise degrees to turn the picture to show it upright: 0, 90, 180 or 270. */
  rotation: 0 | 90 | 180 | 270;
  hasVideo: boolean;
  hasAudio: boolean;
  /** Bits per second of the whole file, null when ffprobe does not know. */
  bitRate: number | null;
  /**
   * MP4 only: whether the moov box comes before mdat (plays before it has fully downloaded).
   * ffprobe cannot tell; probeMedia fills it from the file's box order, null when not MP4.
   */
  moovFirst: boolean | null;
}

interface RawStream {
  codec_type?: string;
  codec_name?: string;
  width?: number;
  height?: number;
  pix_fmt?: string;
  avg_frame_rate?: string;
  r_frame_rate?: string;
  nb_frames?: string;
  duration?: string;
  disposition?: Record<string, number>;
  tags?: Record<string, string>;
  side_data_list?: { side_data_type?: string; rotation?: number }[];
}
interface RawProbe {
  format?: { format_name?: string; duration?: string; start_time?: string; bit_rate?: string; tags?: Record<string, string> };
  streams?: RawStream[];
}

export function normaliseProbe(json: unknown): ProbeResult {
  const raw = (json ?? {}) as RawProbe;
  const streams = Array.isArray(raw.streams) ? raw.streams : [];
  // Cover art in an audio file is a "video" stream too: it is an attached picture, not footage.
  const video = streams.find((s) => s.codec_type === 'video' && !s.disposition?.['attached_pic']);
  const audio = streams.find((s) => s.codec_type === 'audio');
  const format = raw.format ?? {};
  const rotation = video ? streamRotation(video) : 0;
  const width = video?.width ?? 0;
  const height = video?.height ?? 0;
  const quarterTurn = rotation === 90 || rotation === 270;
  const durationSeconds = finiteOr(format.duration, finiteOr(video?.duration, 0));
  return {
    formatName: format.format_name ?? '',
    majorBrand: format.tags?.['major_brand'] ?? null,
    durationMs: Math.round(durationSeconds * 1000),
    startMs: Math.round(finiteOr(format.start_time, 0) * 1000),
    width,
    height,
    displayWidth: quarterTurn ? height : width,
    displayHeight: quarterTurn ? width : height,
    fps: video ? frameRate(video) : 0,
    frameCount: video?.nb_frames !== undefined && Number.isFinite(Number(video.nb_frames)) ? Number(video.nb_frames) : null,
    videoCodec: video?.codec_name ?? null,
    audioCodec: audio?.codec_name ?? null,
    pixelFormat: video?.pix_fmt ?? null,
    rotation,
    hasVideo: video !== undefined,
    hasAudio: audio !== undefined,
    bitRate: format.bit_rate !== undefined && Number.isFinite(Number(format.bit_rate)) ? Number(format.bit_rate) : null,
    moovFirst: null,
  };
}

/** "30000/1001" → 29.97…; "0/0" and junk → 0. */
export function parseRate(rate: string | undefined): number {
  const match = /^(\d+)(?:\/(\d+))?$/.exec(rate ?? '');
  if (!match) return 0;
  const num = Number(match[1]);
  const den = match[2] === undefined ? 1 : Number(match[2]);
  return den > 0 ? num / den : 0;
}

function frameRate(stream: RawStream): number {
  return parseRate(stream.avg_frame_rate) || parseRate(stream.r_frame_rate);
}

/**
 * ffmpeg ≥ 5 reports the display matrix's rotation counter-clockwise (a portrait phone clip says
 * -90); older files and builds carry a clockwise `rotate` tag. Both become clockwise degrees.
 */
function streamRotation(stream: RawStream): 0 | 90 | 180 | 270 {
  const matrix = stream.side_data_list?.find((d) => d.side_data_type === 'Display Matrix' && typeof d.rotation === 'number');
  let clockwise = 0;
  if (matrix) clockwise = -Number(matrix.rotation);
  else if (stream.tags?.['rotate'] !== undefined) clockwise = Number(stream.tags['rotate']);
  if (!Number.isFinite(clockwise)) return 0;
  const quarter = ((Math.round(clockwise / 90) % 4) + 4) % 4;
  return ([0, 90, 180, 270] as const)[quarter]!;
}

function finiteOr(value: string | number | undefined, fallback: number): number {
  const n = Number(value);
  return value !== undefined && value !== '' && Number.isFinite(n) ? n : fallback;
}

/** One video packet from `ffprobe -show_entries packet=pts_time,dts_time,flags`, in file seconds. */
export interface VideoPacket {
  pts: number;
  dts: number;
  key: boolean;
}

/**
 * Parses the CSV lines "pts_time,dts_time,flags" (e.g. "3.700000,3.633333,K_") and shifts them by
 * the container start so they share the timeline of ffmpeg's -ss and of the scene times.
 * Packets without a pts (N/A) are skipped.
 */
export function parseVideoPackets(csv: string, startSeconds = 0): VideoPacket[] {
  const packets: VideoPacket[] = [];
  for (const line of csv.split(/\r?\n/)) {
    const [pts, dts, flags] = line.trim().split(',');
    const p = Number(pts);
    if (!pts || !Number.isFinite(p)) continue;
    const d = Number(dts);
    packets.push({ pts: p - startSeconds, dts: (dts && Number.isFinite(d) ? d : p) - startSeconds, key: (flags ?? '').includes('K') });
  }
  return packets;
}
