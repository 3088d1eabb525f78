import type { Clip, FilmSession, Snap, TagListItem } from '@shared/api/film';

/** Invented test data for the film specs (the demo program: Ironvale Anvils). */
export function filmSession(overrides: Partial<FilmSession> = {}): FilmSession {
  return {
    id: 3,
    teamId: 1,
    seasonId: 5,
    kind: 'game',
    title: 'Week 2 vs Quarry Bend',
    date: '2026-09-11',
    opponent: 'Quarry Bend Badgers',
    homeAway: 'home',
    week: 2,
    periods: [],
    snapCount: 0,
    clipCounts: { received: 0, processing: 0, ready: 0, failed: 0 },
    posterUrl: null,
    ...overrides,
  };
}

export function clip(overrides: Partial<Clip> = {}): Clip {
  const id = overrides.id ?? 40;
  return {
    id,
    sessionId: 3,
    snapId: null,
    kind: 'snap',
    angle: 'sideline',
    originalName: `play_${id}.mp4`,
    status: 'ready',
    failureReason: null,
    progress: 100,
    durationMs: 8000,
    width: 1280,
    height: 720,
    fps: 30,
    sizeBytes: 1_000_000,
    posterUrl: `/api/clips/${id}/poster`,
    playbackUrl: `/api/clips/${id}/playback`,
    stripUrl: `/api/clips/${id}/strip`,
    strip: { frames: 20, intervalMs: 400, tileWidth: 160, tileHeight: 90 },
    proposedCutsMs: null,
    canRetry: false,
    splitDone: false,
    createdAt: '2026-09-12T10:00:00.000Z',
    ...overrides,
  };
}

export function snap(overrides: Partial<Snap> = {}): Snap {
  return {
    id: 21,
    sessionId: 3,
    order: 1,
    quarter: null,
    down: null,
    distance: null,
    yardLine: null,
    fieldSide: null,
    hash: null,
    personnel: null,
    formationId: null,
    conceptId: null,
    direction: null,
    frontId: null,
    resultYards: null,
    outcomeId: null,
    period: null,
    notes: null,
    clips: [],
    ...overrides,
  };
}

export const TAG_ITEMS: TagListItem[] = [
  { id: 101, kind: 'concept', name: 'inside zone', active: true },
  { id: 102, kind: 'concept', name: 'power', active: true },
  { id: 103, kind: 'concept', name: 'iso', active: false },
  { id: 201, kind: 'front', name: 'over', active: true },
  { id: 301, kind: 'formation', name: 'doubles', active: true },
  { id: 401, kind: 'outcome', name: 'run', active: true },
];

/** A key press that reaches the page's document-level shortcuts. */
export function pressKey(key: string, init: KeyboardEventInit = {}, target: EventTarget = document.body): KeyboardEvent {
  const event = new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true, ...init });
  target.dispatchEvent(event);
  return event;
}
