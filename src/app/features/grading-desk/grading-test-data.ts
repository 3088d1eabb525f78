import type { Desk, Grade, GradeSheet, GradeSheetPlayer, GradingProgress, Scheme } from '@shared/api/grading';
import { DEFAULT_MISSED_REASONS, DEFAULT_PENALTY_TYPES } from '@shared/grading';
import type { GridPlayer } from './grade-grid';

/** Invented test data for the grading specs (the demo program: Ironvale Anvils). */
export function scheme(overrides: Partial<Scheme> = {}): Scheme {
  return {
    version: 2,
    extraComponents: [
      { key: 'finish', label: 'Finish', active: true },
      { key: 'eyes', label: 'Eyes', active: false },
    ],
    missedReasons: DEFAULT_MISSED_REASONS,
    penaltyTypes: DEFAULT_PENALTY_TYPES,
    resultRule: { kind: 'strict' },
    winningThreshold: 0.8,
    designatedGraderRole: 'coordinator',
    createdAt: '2026-08-20T12:00:00.000Z',
    createdBy: 'Dana Keel',
    ...overrides,
  };
}

/** The five of the demo line, left to right. */
export const LINE: GridPlayer[] = [
  { playerId: 11, name: 'Tomas Varga', jersey: 74, position: 'LT', alsoGradedBy: [] },
  { playerId: 12, name: 'Rowan Pike', jersey: 66, position: 'LG', alsoGradedBy: [] },
  { playerId: 13, name: 'Eli Brandt', jersey: 55, position: 'C', alsoGradedBy: ['Cal Dorsey'] },
  { playerId: 14, name: 'Odell Fry', jersey: 61, position: 'RG', alsoGradedBy: [] },
  { playerId: 15, name: 'Marek Stoll', jersey: 78, position: 'RT', alsoGradedBy: [] },
];

export function grade(overrides: Partial<Grade> = {}): Grade {
  return {
    id: 900,
    snapId: 21,
    playerId: 11,
    graderId: 7,
    graderName: 'Dana Keel',
    assignment: null,
    missedReason: null,
    footwork: null,
    hands: null,
    padLevel: null,
    extra: {},
    effort: null,
    knockdowns: 0,
    pressuresAllowed: 0,
    sacksAllowed: 0,
    penalties: [],
    note: null,
    result: null,
    schemeVersion: 2,
    version: 1,
    updatedAt: '2026-09-13T09:30:00.000Z',
    ...overrides,
  };
}

export function desk(overrides: Partial<Desk> = {}): Desk {
  return {
    sessionId: 3,
    teamId: 1,
    scheme: scheme(),
    locked: false,
    players: LINE.map((p) => ({ playerId: p.playerId, name: p.name, jersey: p.jersey, positions: [p.position] })).concat([
      { playerId: 16, name: 'Jonah Reyes', jersey: 88, positions: ['TE'] },
    ]),
    snaps: [
      {
        snapId: 21,
        order: 1,
        participants: LINE.map((p) => ({ playerId: p.playerId, position: p.position })),
        participantsFromDepthChart: true,
        myGrades: [],
        otherGraders: [{ graderId: 9, name: 'Cal Dorsey', playerIds: [13] }],
      },
      {
        snapId: 22,
        order: 2,
        participants: LINE.map((p) => ({ playerId: p.playerId, position: p.position })),
        participantsFromDepthChart: true,
        myGrades: [],
        otherGraders: [],
      },
    ],
    ...overrides,
  };
}

export function progress(overrides: Partial<GradingProgress> = {}): GradingProgress {
  return {
    expectedCells: 10,
    graders: [{ graderId: 7, name: 'Dana Keel', gradedCells: 0, designated: false }],
    finalCells: 0,
    locked: false,
    lockHistory: [],
    ...overrides,
  };
}

export function sheetPlayer(overrides: Partial<GradeSheetPlayer> = {}): GradeSheetPlayer {
  return {
    playerId: 11,
    name: 'Tomas Varga',
    jersey: 74,
    positions: ['LT'],
    snapsPlayed: 60,
    snaps: 58,
    plus: 46,
    plusRate: 46 / 58,
    meetsWinningGrade: false,
    components: {
      assignment: { plus: 55, minus: 3, rate: 55 / 58 },
      footwork: { plus: 50, minus: 8, rate: 50 / 58 },
      hands: { plus: 49, minus: 9, rate: 49 / 58 },
      padLevel: { plus: 52, minus: 6, rate: 52 / 58 },
      finish: { plus: 40, minus: 18, rate: 40 / 58 },
      effort: { plus: 57, minus: 1, rate: 57 / 58 },
    },
    missedAssignments: 3,
    missedByReason: { 'wrong gap or man': 2, communication: 1 },
    knockdowns: 4,
    pressuresAllowed: 2,
    sacksAllowed: 1,
    penalties: 1,
    penaltiesByType: { holding: 1 },
    notes: [{ snapOrder: 12, note: 'Punch late on the double; hands inside first.' }],
    ...overrides,
  };
}

export function gradeSheet(players: GradeSheetPlayer[]): GradeSheet {
  return {
    sessionId: 3,
    winningThreshold: 0.8,
    players,
    unit: {
      snaps: 2,
      allPlus: 1,
      incomplete: 0,
      rate: 0.5,
      bySnap: [
        { snapId: 21, order: 1, onField: 5, graded: 5, plus: 5, counted: true, allPlus: true, minusPlayerIds: [], weakestLinkIds: [] },
        { snapId: 22, order: 2, onField: 5, graded: 5, plus: 4, counted: true, allPlus: false, minusPlayerIds: [13], weakestLinkIds: [13] },
      ],
    },
  };
}

/** A key press where the keyboard focus is, as the browser would send it. */
export function press(key: string, init: KeyboardEventInit = {}): KeyboardEvent {
  const event = new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true, ...init });
  (document.activeElement ?? document.body).dispatchEvent(event);
  return event;
}
