import type { MyClip } from './study-api';

/** The Study Report counts a clip as watched from 90 % played (server rule); the queue says the same. */
export const WATCHED_FROM = 0.9;

export interface ClipStudyState {
  /** Coaching points for him (his own questions are not points). */
  points: number;
  /** Points he has not said "Got it" to yet. */
  newPoints: number;
  allAcknowledged: boolean;
  questions: number;
  watchedPercent: number;
  watched: boolean;
}

export function studyState(clip: MyClip): ClipStudyState {
  const points = clip.comments.filter((c) => c.kind !== 'question');
  const newPoints = points.filter((c) => !c.acknowledged).length;
  const fraction = Math.min(1, Math.max(0, clip.watchedFraction));
  return {
    points: points.length,
    newPoints,
    allAcknowledged: points.length > 0 && newPoints === 0,
    questions: clip.comments.length - points.length,
    watchedPercent: Math.round(fraction * 100),
    watched: fraction >= WATCHED_FROM,
  };
}

/** How much he watched, in words (the bar beside it only repeats this). */
export function watchedWords(fraction: number): string {
  const percent = Math.round(Math.min(1, Math.max(0, fraction)) * 100);
  if (percent === 0) return 'Not watched yet';
  if (fraction >= WATCHED_FROM) return `Watched (${percent} %)`;
  return `${percent} % watched`;
}

export interface SessionGroup {
  sessionId: number;
  sessionTitle: string;
  sessionDate: string;
  clips: MyClip[];
}

/** Clips come newest first; sessions keep the order of their newest clip, clips keep theirs. */
export function groupBySession(clips: readonly MyClip[]): SessionGroup[] {
  const groups = new Map<number, SessionGroup>();
  for (const clip of clips) {
    let group = groups.get(clip.sessionId);
    if (!group) {
      group = { sessionId: clip.sessionId, sessionTitle: clip.sessionTitle, sessionDate: clip.sessionDate, clips: [] };
      groups.set(clip.sessionId, group);
    }
    group.clips.push(clip);
  }
  return [...groups.values()];
}

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}
