import type { Interval } from '@shared/stats';
import type { DevelopmentComponent, RateShape } from '../progress/development-types';

/** GET /api/comparisons?players=… (server/development/comparison.service.ts). */
export interface ComparedPlayer extends RateShape {
  playerId: number;
  name: string;
  /** Components with at least one mark; a part never graded is missing. */
  components: Partial<Record<DevelopmentComponent, RateShape>>;
  /** Snaps graded at each position this season. */
  positionsPlayed: Record<string, number>;
  sparkline: { date: string; rate: number | null }[];
}

export interface ComparedPair {
  a: number;
  b: number;
  difference: number | null;
  z: number | null;
  pValue: number | null;
  probabilityABetter: number;
  /** The API's plain reading of the pair (shared/stats comparePair). */
  reading: string;
  warning: string | null;
}

export interface Comparison {
  seasonId: number;
  players: ComparedPlayer[];
  pairs: ComparedPair[];
}

export type { Interval };
