import type { Desk } from '@shared/api/grading';

/** A desk for session 3 whose snap 21 had Bram Oakes at LT and Dana Keel at LG (invented names). */
export function deskFor(): Desk {
  return {
    sessionId: 3,
    teamId: 1,
    locked: false,
    scheme: {
      version: 1,
      extraComponents: [{ key: 'finish', label: 'Finish', active: true }],
      missedReasons: ['wrong gap or man'],
      penaltyTypes: ['holding'],
      resultRule: { kind: 'strict' },
      winningThreshold: 0.8,
      designatedGraderRole: 'coach',
      createdAt: '2026-08-01T00:00:00.000Z',
      createdBy: null,
    },
    players: [
      { playerId: 74, name: 'Dana Keel', jersey: 74, positions: ['LG'] },
      { playerId: 70, name: 'Bram Oakes', jersey: 70, positions: ['LT'] },
      { playerId: 55, name: 'Ty Brandt', jersey: 55, positions: ['C'] },
    ],
    snaps: [
      {
        snapId: 21,
        order: 12,
        participants: [
          { playerId: 74, position: 'LG' },
          { playerId: 70, position: 'LT' },
        ],
        participantsFromDepthChart: true,
        myGrades: [],
        otherGraders: [],
      },
    ],
  };
}
