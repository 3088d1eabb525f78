/** Film vocabulary: session kinds, camera angles, clip states, and the snap tag lists' defaults. */
export const SESSION_KINDS = ['game', 'scrimmage', 'practice'] as const;
export type SessionKind = (typeof SESSION_KINDS)[number];

export const ANGLES = ['sideline', 'end_zone', 'other'] as const;
export type Angle = (typeof ANGLES)[number];
export const ANGLE_LABELS: Record<Angle, string> = { sideline: 'Sideline', end_zone: 'End zone', other: 'Other' };

/** Clip states, in the order a clip moves through them. `ready` and `failed` are final. */
export const CLIP_STATES = ['received', 'processing', 'ready', 'failed'] as const;
export type ClipState = (typeof CLIP_STATES)[number];
export const CLIP_STATE_LABELS: Record<ClipState, string> = {
  received: 'Received',
  processing: 'Processing',
  ready: 'Ready',
  failed: 'Failed',
};

/** A clip is one snap from one angle, or a continuous tape that the Cut Planner splits into snaps. */
export const CLIP_KINDS = ['snap', 'tape'] as const;
export type ClipKind = (typeof CLIP_KINDS)[number];

export const HASHES = ['left', 'middle', 'right'] as const;
export type Hash = (typeof HASHES)[number];
export const DIRECTIONS = ['left', 'middle', 'right'] as const;
export type Direction = (typeof DIRECTIONS)[number];
export const FIELD_SIDES = ['own', 'opp'] as const;
export type FieldSide = (typeof FIELD_SIDES)[number];

/** The team lists behind snap tags. Each team edits its own; these seed a new team (common practice). */
export const TAG_LIST_KINDS = ['formation', 'concept', 'front', 'outcome'] as const;
export type TagListKind = (typeof TAG_LIST_KINDS)[number];

export const DEFAULT_TAG_LISTS: Record<TagListKind, readonly string[]> = {
  concept: ['inside zone', 'outside zone', 'power', 'counter', 'pin-and-pull', 'trap', 'draw', 'dropback protection', 'play action', 'quick game', 'screen'],
  front: ['over', 'under', 'bear', 'okie', 'even', 'tite'],
  formation: ['doubles', 'trips', 'bunch', 'pro', 'twins', 'empty', 'heavy', 'I'],
  outcome: ['run', 'complete', 'incomplete', 'sack', 'scramble', 'penalty', 'turnover', 'touchdown'],
};

/** Personnel in the trade's two digits: running backs, then tight ends (11, 12, 21, 10…). */
export const PERSONNEL_PATTERN = /^[0-5][0-5]$/;

export function describePersonnel(code: string): string {
  if (!PERSONNEL_PATTERN.test(code)) return code;
  const backs = Number(code[0]);
  const ends = Number(code[1]);
  const receivers = 5 - backs - ends;
  const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
  return `${plural(backs, 'back')}, ${plural(ends, 'tight end')}${receivers >= 0 ? `, ${plural(receivers, 'receiver')}` : ''}`;
}

/** Milliseconds → "m:ss.t" for timelines and failure reasons. */
export function formatClock(ms: number): string {
  const totalTenths = Math.max(0, Math.round(ms / 100));
  const minutes = Math.floor(totalTenths / 600);
  const seconds = Math.floor((totalTenths % 600) / 10);
  const tenths = totalTenths % 10;
  return `${minutes}:${String(seconds).padStart(2, '0')}.${tenths}`;
}

/** The shortest snap the Cut Planner accepts between two cuts: half a second (a snap lasts several). */
export const MIN_SEGMENT_MS = 500;
