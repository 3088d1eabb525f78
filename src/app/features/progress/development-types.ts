import type { Interval, TrendReading } from '@shared/stats';

/**
 * The shapes of GET /api/players/{id}/development (server/development/development.service.ts).
 * The API publishes no zod schema for the whole answer, so the client keeps these types beside the page.
 */
export interface RateShape {
  snaps: number;
  plus: number;
  /** plus ÷ snaps, 0–1; null when nothing was graded. */
  rate: number | null;
  /** 95 % Wilson interval; null when nothing was graded. */
  interval: Interval | null;
}

export const DEVELOPMENT_COMPONENTS = ['assignment', 'footwork', 'hands', 'padLevel', 'effort'] as const;
export type DevelopmentComponent = (typeof DEVELOPMENT_COMPONENTS)[number];
export type GoalComponent = 'overall' | DevelopmentComponent;

export const COMPONENT_NAMES: Record<GoalComponent, string> = {
  overall: 'Overall grade',
  assignment: 'Assignment',
  footwork: 'Footwork',
  hands: 'Hands',
  padLevel: 'Pad level',
  effort: 'Effort',
};

export interface DevelopmentSession extends RateShape {
  sessionId: number;
  date: string;
  kind: 'game' | 'scrimmage' | 'practice';
  title: string;
  /** Pooled plus rate of the last few sessions; null until the window is full. */
  rolling: number | null;
}

export interface ComponentSession extends RateShape {
  sessionId: number;
  date: string;
}

export interface ComponentTrend {
  sessions: ComponentSession[];
  rolling: (number | null)[];
}

export interface WeekRate extends RateShape {
  weekStart: string;
}

export interface DevelopmentTrend {
  /** Change of the weekly plus rate per week (0.01 = 1 point a week); null below 2 weeks. */
  slopePerWeek: number | null;
  slopeInterval: Interval | null;
  weeks: number;
  reading: TrendReading;
}

export const SPLIT_KINDS = ['concept', 'front', 'personnel', 'downDistance', 'hash', 'quarter', 'sessionKind', 'position'] as const;
export type SplitKind = (typeof SPLIT_KINDS)[number];

export const SPLIT_NAMES: Record<SplitKind, string> = {
  concept: 'Concept',
  front: 'Front',
  personnel: 'Personnel',
  downDistance: 'Down & distance',
  hash: 'Hash',
  quarter: 'Quarter',
  sessionKind: 'Game vs practice',
  position: 'Position',
};

export interface SplitRow extends RateShape {
  value: string;
}

export interface Ranked {
  strongest: SplitRow[];
  weakest: SplitRow[];
}

export interface Goal {
  id: number;
  component: GoalComponent;
  target: number;
  dueOn: string | null;
  note: string | null;
  achievedAt: string | null;
  setBy: string | null;
  createdAt: string;
  current: number | null;
  met: boolean;
}

export interface CoachNote {
  id: number;
  body: string;
  author: string;
  createdAt: string;
}

export interface Development {
  playerId: number;
  name: string;
  seasonId: number;
  winningThreshold: number;
  sessions: DevelopmentSession[];
  overall: RateShape;
  components: Record<DevelopmentComponent, RateShape>;
  componentTrends: Record<DevelopmentComponent, ComponentTrend>;
  weeks: WeekRate[];
  trend: DevelopmentTrend;
  splits: Record<SplitKind, SplitRow[]>;
  concepts: Ranked;
  fronts: Ranked;
  goals: Goal[];
  notes: CoachNote[];
}
