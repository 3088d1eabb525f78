import { z } from 'zod';
import { ASSIGNMENT_MARKS, EFFORT_MARKS, MARKS } from '../grading';
import { POSITIONS } from '../roster';
import { idSchema } from './common';

const mark = z.enum(MARKS).nullable();
const count = z.number().int('Counts are whole numbers.').min(0, 'Counts cannot be negative.').max(99, 'That count looks wrong.');

export const penaltySchema = z.object({ type: z.string().trim().min(1).max(60) });

/** PUT /api/snaps/{snapId}/grades/{playerId}: one coach's grade of one lineman on one snap. */
export const gradeInputSchema = z.object({
  assignment: z.enum(ASSIGNMENT_MARKS).nullable().default(null),
  missedReason: z.string().trim().max(80).nullable().default(null),
  footwork: mark.default(null),
  hands: mark.default(null),
  padLevel: mark.default(null),
  /** Team-added components (eyes/target, finish…) by key. */
  extra: z.record(z.string().max(40), mark).default({}),
  effort: z.enum(EFFORT_MARKS).nullable().default(null),
  knockdowns: count.default(0),
  pressuresAllowed: count.default(0),
  sacksAllowed: count.default(0),
  penalties: z.array(penaltySchema).max(10).default([]),
  note: z.string().max(2000).nullable().default(null),
  /** The version the coach last saw; omitted or 0 for a new grade. */
  version: z.number().int().min(0).default(0),
});
export type GradeInput = z.infer<typeof gradeInputSchema>;

export const gradeSchema = z.object({
  id: z.number().int(),
  snapId: z.number().int(),
  playerId: z.number().int(),
  graderId: z.number().int(),
  graderName: z.string(),
  assignment: z.enum(ASSIGNMENT_MARKS).nullable(),
  missedReason: z.string().nullable(),
  footwork: mark,
  hands: mark,
  padLevel: mark,
  extra: z.record(z.string(), mark),
  effort: z.enum(EFFORT_MARKS).nullable(),
  knockdowns: z.number().int(),
  pressuresAllowed: z.number().int(),
  sacksAllowed: z.number().int(),
  penalties: z.array(penaltySchema),
  note: z.string().nullable(),
  result: z.enum(['plus', 'minus']).nullable(),
  schemeVersion: z.number().int(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Grade = z.infer<typeof gradeSchema>;

export const gradeParams = z.object({ snapId: idSchema, playerId: idSchema });

export const participantSchema = z.object({ playerId: z.number().int(), position: z.enum(POSITIONS) });
export const participantsInputSchema = z.object({
  participants: z
    .array(z.object({ playerId: idSchema, position: z.enum(POSITIONS) }))
    .max(9, 'At most nine blockers on one snap.')
    .refine((list) => new Set(list.map((p) => p.playerId)).size === list.length, 'A player is listed twice.'),
});

const extraComponentSchema = z.object({
  key: z.string().regex(/^[a-z][a-zA-Z0-9]{1,30}$/, 'Keys are letters and digits, starting with a small letter.'),
  label: z.string().trim().min(1).max(40),
  active: z.boolean(),
});

export const resultRuleSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('strict') }),
  z.object({
    kind: z.literal('points'),
    weights: z.record(z.string(), z.number().min(0).max(10)),
    missedPenalty: z.number().min(0).max(20),
    passPoints: z.number().min(-50).max(50),
  }),
]);

export const schemeInputSchema = z.object({
  extraComponents: z.array(extraComponentSchema).max(8),
  missedReasons: z.array(z.string().trim().min(1).max(80)).min(1).max(30),
  penaltyTypes: z.array(z.string().trim().min(1).max(60)).min(1).max(30),
  resultRule: resultRuleSchema,
  winningThreshold: z.number().min(0.5).max(1),
  designatedGraderRole: z.enum(['admin', 'coordinator', 'coach']),
});
export type SchemeInput = z.infer<typeof schemeInputSchema>;

export const schemeSchema = schemeInputSchema.extend({
  version: z.number().int(),
  createdAt: z.string(),
  createdBy: z.string().nullable(),
});
export type Scheme = z.infer<typeof schemeSchema>;

const tallySchema = z.object({ plus: z.number().int(), minus: z.number().int(), rate: z.number().nullable() });

export const gradeSheetPlayerSchema = z.object({
  playerId: z.number().int(),
  name: z.string(),
  jersey: z.number().int().nullable(),
  positions: z.array(z.string()),
  snapsPlayed: z.number().int(),
  snaps: z.number().int(),
  plus: z.number().int(),
  plusRate: z.number().nullable(),
  meetsWinningGrade: z.boolean().nullable(),
  components: z.record(z.string(), tallySchema),
  missedAssignments: z.number().int(),
  missedByReason: z.record(z.string(), z.number().int()),
  knockdowns: z.number().int(),
  pressuresAllowed: z.number().int(),
  sacksAllowed: z.number().int(),
  penalties: z.number().int(),
  penaltiesByType: z.record(z.string(), z.number().int()),
  notes: z.array(z.object({ snapOrder: z.number().int(), note: z.string() })),
});
export type GradeSheetPlayer = z.infer<typeof gradeSheetPlayerSchema>;

export const gradeSheetSchema = z.object({
  sessionId: z.number().int(),
  winningThreshold: z.number(),
  players: z.array(gradeSheetPlayerSchema),
  unit: z.object({
    /** Snaps that count: every lineman on the field graded (shared/stats unitSnapOutcome). */
    snaps: z.number().int(),
    allPlus: z.number().int(),
    /** Snaps left out until everyone on them is graded. */
    incomplete: z.number().int(),
    rate: z.number().nullable(),
    bySnap: z.array(
      z.object({
        snapId: z.number().int(),
        order: z.number().int(),
        onField: z.number().int(),
        graded: z.number().int(),
        plus: z.number().int(),
        counted: z.boolean(),
        allPlus: z.boolean(),
        minusPlayerIds: z.array(z.number().int()),
        /** Who lost the snap for a unit that otherwise won it; empty when nobody stands out. */
        weakestLinkIds: z.array(z.number().int()),
      }),
    ),
  }),
});
export type GradeSheet = z.infer<typeof gradeSheetSchema>;

export const gradingLockSchema = z.object({
  locked: z.boolean(),
  reason: z.string().trim().max(300).optional(),
});

export const gradingProgressSchema = z.object({
  expectedCells: z.number().int(),
  graders: z.array(z.object({ graderId: z.number().int(), name: z.string(), gradedCells: z.number().int(), designated: z.boolean() })),
  finalCells: z.number().int(),
  locked: z.boolean(),
  lockHistory: z.array(z.object({ action: z.enum(['locked', 'unlocked']), by: z.string(), at: z.string(), reason: z.string().nullable() })),
});
export type GradingProgress = z.infer<typeof gradingProgressSchema>;

export const deskSnapSchema = z.object({
  snapId: z.number().int(),
  order: z.number().int(),
  participants: z.array(participantSchema),
  /** Whether the list came from the depth chart (no substitutions recorded for this snap yet). */
  participantsFromDepthChart: z.boolean(),
  myGrades: z.array(gradeSchema),
  otherGraders: z.array(z.object({ graderId: z.number().int(), name: z.string(), playerIds: z.array(z.number().int()) })),
});

export const deskSchema = z.object({
  sessionId: z.number().int(),
  teamId: z.number().int(),
  scheme: schemeSchema,
  locked: z.boolean(),
  players: z.array(z.object({ playerId: z.number().int(), name: z.string(), jersey: z.number().int().nullable(), positions: z.array(z.string()) })),
  snaps: z.array(deskSnapSchema),
});
export type Desk = z.infer<typeof deskSchema>;

export const depthChartPositions = ['LT', 'LG', 'C', 'RG', 'RT', 'TE'] as const;
/** A chart week: 0 is the base (preseason) chart; the same range as a film session's week. */
export const chartWeekSchema = z.coerce.number().int().min(0).max(25);
export const depthChartSchema = z.object({
  seasonId: z.number().int(),
  positions: z.record(z.string(), z.array(z.object({ playerId: z.number().int(), name: z.string(), jersey: z.number().int().nullable() }))),
  /** The last change to the chart shown (its saved week). */
  updatedAt: z.string().nullable(),
  /** The week asked for; without one, the current week (the latest saved, 0 when none is). */
  week: z.number().int(),
  /** The saved week whose chart is shown: below `week` when it carries forward; null when none is in force. */
  inForceFromWeek: z.number().int().nullable(),
  /** Every week of the season with a chart of its own, ascending. */
  savedWeeks: z.array(z.number().int()),
  /** The highest week of the season's games (null: no game has a week yet), so a week picker knows how far to go. */
  lastGameWeek: z.number().int().nullable(),
});
export type DepthChart = z.infer<typeof depthChartSchema>;
export const depthChartQuerySchema = z.object({ seasonId: idSchema.optional(), week: chartWeekSchema.optional() });
export const depthChartInputSchema = z.object({
  seasonId: idSchema.optional(),
  /** The week saved for (its chart then runs until a later week's); default the current (latest saved) week. */
  week: chartWeekSchema.optional(),
  // Only the positions sent are replaced (partialRecord: zod 4's record of an enum wants every key).
  positions: z.partialRecord(z.enum(depthChartPositions), z.array(idSchema).max(8)),
  reason: z.string().trim().max(300).optional(),
});
const chartEntrySchema = z.object({ position: z.string(), rank: z.number().int(), playerId: z.number().int() });
export const depthChartHistorySchema = z.object({
  changes: z.array(
    z.object({
      id: z.number().int(),
      /** The week the change was saved for. */
      week: z.number().int(),
      by: z.string(),
      at: z.string(),
      reason: z.string().nullable(),
      before: z.array(chartEntrySchema),
      after: z.array(chartEntrySchema),
    }),
  ),
});
export type DepthChartHistory = z.infer<typeof depthChartHistorySchema>;
