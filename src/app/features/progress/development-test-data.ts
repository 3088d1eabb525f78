import { rateWithInterval } from '@shared/stats';
import type { Team } from '@shared/api/team';
import type { Development, RateShape } from './development-types';

/** Invented test data for the development specs (the demo program: Ironvale Anvils). */
export const TEAM: Team = {
  id: 1,
  name: 'Ironvale Anvils',
  currentSeasonId: 5,
  sharing: { gradesWithPlayers: true, unitWithPlayers: false },
  seasons: [
    { id: 4, name: '2025 season', startsOn: '2025-08-01', endsOn: '2025-11-30', isCurrent: false },
    { id: 5, name: '2026 season', startsOn: '2026-08-01', endsOn: '2026-11-30', isCurrent: true },
  ],
};

export function rate(plus: number, minus: number): RateShape {
  const r = rateWithInterval(plus, minus);
  return { snaps: r.snaps, plus: r.plus, rate: r.rate, interval: r.interval };
}

const SESSIONS = [
  { sessionId: 31, date: '2026-09-04', kind: 'game' as const, title: 'Week 1 vs Carrow Ridge', plus: 38, minus: 14 },
  { sessionId: 32, date: '2026-09-09', kind: 'practice' as const, title: 'Tuesday practice', plus: 22, minus: 8 },
  { sessionId: 33, date: '2026-09-11', kind: 'game' as const, title: 'Week 2 at Fenmoor', plus: 44, minus: 12 },
  { sessionId: 34, date: '2026-09-18', kind: 'game' as const, title: 'Week 3 vs Slate Hollow', plus: 47, minus: 10 },
  { sessionId: 35, date: '2026-09-25', kind: 'game' as const, title: 'Week 4 at Brindle Point', plus: 50, minus: 8 },
];

export function development(overrides: Partial<Development> = {}): Development {
  const sessions = SESSIONS.map((s, i) => {
    const window = SESSIONS.slice(Math.max(0, i - 2), i + 1);
    const plus = window.reduce((n, w) => n + w.plus, 0);
    const snaps = window.reduce((n, w) => n + w.plus + w.minus, 0);
    return { sessionId: s.sessionId, date: s.date, kind: s.kind, title: s.title, ...rate(s.plus, s.minus), rolling: i < 2 ? null : plus / snaps };
  });
  const part = (plus: number[], minus: number[]) => ({
    sessions: SESSIONS.map((s, i) => ({ sessionId: s.sessionId, date: s.date, ...rate(plus[i], minus[i]) })),
    rolling: SESSIONS.map((_, i) => (i < 2 ? null : 0.8)),
  });
  return {
    playerId: 11,
    name: 'Tomas Varga',
    seasonId: 5,
    winningThreshold: 0.8,
    sessions,
    overall: rate(201, 52),
    components: {
      assignment: rate(240, 13),
      footwork: rate(200, 53),
      hands: rate(190, 63),
      padLevel: rate(170, 83),
      effort: rate(250, 3),
    },
    componentTrends: {
      assignment: part([50, 28, 53, 55, 54], [2, 2, 3, 2, 4]),
      footwork: part([40, 22, 44, 46, 48], [12, 8, 12, 11, 10]),
      hands: part([38, 20, 42, 44, 46], [14, 10, 14, 13, 12]),
      padLevel: part([30, 18, 36, 40, 46], [22, 12, 20, 17, 12]),
      effort: part([52, 30, 56, 57, 55], [0, 0, 0, 0, 3]),
    },
    weeks: [],
    trend: { slopePerWeek: 0.031, slopeInterval: [0.012, 0.05], weeks: 4, reading: 'improving' },
    splits: {
      concept: [
        { value: 'Inside zone', ...rate(70, 12) },
        { value: 'Power', ...rate(40, 18) },
        { value: 'Counter', ...rate(5, 4) },
      ],
      front: [
        { value: 'Over', ...rate(80, 14) },
        { value: 'Bear', ...rate(20, 15) },
      ],
      personnel: [{ value: '11', ...rate(150, 40) }],
      downDistance: [{ value: '1st down', ...rate(90, 20) }],
      hash: [{ value: 'left', ...rate(60, 20) }],
      quarter: [{ value: '1', ...rate(50, 10) }],
      sessionKind: [
        { value: 'game', ...rate(179, 44) },
        { value: 'practice', ...rate(22, 8) },
      ],
      position: [{ value: 'LT', ...rate(201, 52) }],
    },
    concepts: { strongest: [{ value: 'Inside zone', ...rate(70, 12) }], weakest: [{ value: 'Power', ...rate(40, 18) }] },
    fronts: { strongest: [{ value: 'Over', ...rate(80, 14) }], weakest: [{ value: 'Bear', ...rate(20, 15) }] },
    goals: [
      { id: 3, component: 'padLevel', target: 0.8, dueOn: '2026-10-30', note: 'Stay low out of the stance', achievedAt: null, setBy: 'Dana Keel', createdAt: '2026-09-01T10:00:00.000Z', current: 170 / 253, met: false },
    ],
    notes: [{ id: 8, body: 'Quicker first step against the 4i.', author: 'Dana Keel', createdAt: '2026-09-20T09:00:00.000Z' }],
    ...overrides,
  };
}
