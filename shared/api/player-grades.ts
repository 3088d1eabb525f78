import { z } from 'zod';
import { idSchema } from './common';
import { gradeSheetPlayerSchema } from './grading';

/** One part of a player's final grade on a snap, named for him. */
export const snapGradeMarkSchema = z.object({
  key: z.string(),
  label: z.string(),
  mark: z.enum(['plus', 'minus', 'right', 'missed', 'loaf']).nullable(),
});

/**
 * A player's final grade on one snap, from the final_grades view (result as the view holds it:
 * null while the assignment is not marked). Shown to him only when his staff shares grades.
 */
export const snapGradeSchema = z.object({
  result: z.enum(['plus', 'minus']).nullable(),
  marks: z.array(snapGradeMarkSchema),
});
export type SnapGrade = z.infer<typeof snapGradeSchema>;

/** GET /api/film-sessions/{id}/grade-sheet/players/{playerId}: one player's row of a session's Grade Sheet. */
export const playerGradeSheetSchema = z.object({
  sessionId: z.number().int(),
  sessionTitle: z.string(),
  sessionDate: z.string(),
  winningThreshold: z.number(),
  /** Names of the team's own parts of a grade, by key. */
  extraLabels: z.record(z.string(), z.string()),
  /** Null when he has no final grade in the session yet. */
  player: gradeSheetPlayerSchema.nullable(),
});
export type PlayerGradeSheet = z.infer<typeof playerGradeSheetSchema>;

export const playerSheetParams = z.object({ id: idSchema, playerId: idSchema });
