import type { DevelopmentComponent } from '../progress/development-types';

/** GET /api/teams/{teamId}/agreement (server/development/agreement.service.ts). */
export interface ComponentAgreement {
  snaps: number;
  kappa: number | null;
  observed: number | null;
  expected: number | null;
  note: 'no snaps compared' | 'one label only' | null;
}

export interface Disagreement {
  snapId: number;
  sessionId: number;
  sessionTitle: string;
  snapOrder: number;
  playerId: number;
  playerName: string;
  component: DevelopmentComponent;
  a: string;
  b: string;
}

export interface Agreement {
  graderA: number;
  graderB: number;
  components: Record<DevelopmentComponent, ComponentAgreement>;
  disagreements: Disagreement[];
}
