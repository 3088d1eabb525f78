import type { Comment } from '@shared/api/film-room';
import type { SnapGrade } from '@shared/api/player-grades';
import type { MyClip, MyClipPoint } from './study-api';

/** Invented film-room test data (the demo program: Ironvale Anvils). Player 74 is the signed-in player. */
export function myClip(overrides: Partial<MyClip> = {}): MyClip {
  const clipId = overrides.clipId ?? 40;
  return {
    clipId,
    sessionId: 3,
    sessionTitle: 'Week 2 vs Quarry Bend',
    sessionDate: '2026-09-11',
    snapOrder: 12,
    angle: 'sideline',
    posterUrl: `/api/clips/${clipId}/poster`,
    playbackUrl: `/api/clips/${clipId}/playback`,
    durationMs: 8000,
    watchedFraction: 0,
    newest: '2026-09-12T18:00:00.000Z',
    comments: [],
    grade: null,
    ...overrides,
  };
}

/** A final grade as the queue carries it: a plus with every part marked, the team's "Finish" among them. */
export function snapGrade(overrides: Partial<SnapGrade> = {}): SnapGrade {
  return {
    result: 'plus',
    marks: [
      { key: 'assignment', label: 'Assignment', mark: 'right' },
      { key: 'footwork', label: 'Footwork', mark: 'plus' },
      { key: 'hands', label: 'Hands', mark: 'plus' },
      { key: 'padLevel', label: 'Pad level', mark: 'plus' },
      { key: 'finish', label: 'Finish', mark: 'plus' },
      { key: 'effort', label: 'Effort', mark: 'plus' },
    ],
    ...overrides,
  };
}

export function queuePoint(overrides: Partial<MyClipPoint> = {}): MyClipPoint {
  return { id: 500, atMs: 1200, endMs: null, kind: 'correction', component: 'padLevel', body: 'Stay low out of your stance.', author: 'Coach Harlan Voss', acknowledged: false, replies: 0, ...overrides };
}

export function comment(overrides: Partial<Comment> = {}): Comment {
  return {
    id: 500,
    clipId: 40,
    parentId: null,
    atMs: 1200,
    endMs: null,
    kind: 'correction',
    component: 'padLevel',
    body: 'Stay low out of your stance.',
    hidden: false,
    edited: false,
    author: { id: 3, name: 'Coach Harlan Voss', isStaff: true },
    createdAt: '2026-09-12T18:00:00.000Z',
    targets: [{ playerId: 74, name: 'Dana Keel', acknowledged: false }],
    replies: [],
    ...overrides,
  };
}
