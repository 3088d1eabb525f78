import { z } from 'zod';
import { COMMENT_KINDS, POINT_KINDS, POSITION_GROUPS } from '../film-room';
import { idSchema } from './common';
import { snapGradeSchema } from './player-grades';

/** POST /api/clips/{id}/comments: a coaching point for one or more players (staff only). */
export const pointCreateSchema = z
  .object({
    playerIds: z.array(idSchema).min(1, 'Choose at least one player.').max(30),
    atMs: z.number().int().min(0),
    endMs: z.number().int().min(0).optional(),
    kind: z.enum(POINT_KINDS).default('teaching'),
    component: z.string().max(40).optional(),
    body: z.string().trim().min(1, 'Write the coaching point.').max(2000),
  })
  .refine((p) => p.endMs === undefined || p.endMs > p.atMs, { message: 'The span must end after it starts.', path: ['endMs'] });

export const questionCreateSchema = z.object({ atMs: z.number().int().min(0), body: z.string().trim().min(1, 'Write your question.').max(2000) });
export const replyCreateSchema = z.object({ body: z.string().trim().min(1, 'Write a reply.').max(2000) });
export const commentEditSchema = z.object({ body: z.string().trim().min(1).max(2000) });

const commentFields = z.object({
  id: z.number().int(),
  clipId: z.number().int(),
  parentId: z.number().int().nullable(),
  atMs: z.number().int(),
  endMs: z.number().int().nullable(),
  kind: z.enum(COMMENT_KINDS),
  component: z.string().nullable(),
  body: z.string(),
  hidden: z.boolean(),
  edited: z.boolean(),
  author: z.object({ id: z.number().int(), name: z.string(), isStaff: z.boolean() }),
  createdAt: z.string(),
  targets: z.array(z.object({ playerId: z.number().int(), name: z.string(), acknowledged: z.boolean() })),
});
/** A thread is one level deep: a point or question, and its replies. */
export const commentSchema = commentFields.extend({ replies: z.array(commentFields).optional() });
export type Comment = z.infer<typeof commentSchema>;

export const myClipsSchema = z.object({
  clips: z.array(
    z.object({
      clipId: z.number().int(),
      sessionId: z.number().int(),
      sessionTitle: z.string(),
      sessionDate: z.string(),
      snapOrder: z.number().int().nullable(),
      angle: z.string(),
      posterUrl: z.string().nullable(),
      playbackUrl: z.string().nullable(),
      durationMs: z.number().nullable(),
      watchedFraction: z.number(),
      newest: z.string(),
      comments: z.array(z.object({ id: z.number().int(), atMs: z.number().int(), endMs: z.number().int().nullable(), kind: z.string(), component: z.string().nullable(), body: z.string(), author: z.string(), acknowledged: z.boolean(), replies: z.number().int() })),
      /** His final grade on the clip's snap; null when not graded, not a snap, or grades are not shared. */
      grade: snapGradeSchema.nullable(),
    }),
  ),
  /** Whether his staff shares grades with players (the team's setting). */
  gradesShared: z.boolean(),
});

export const viewReportSchema = z.object({ fromMs: z.number().int().min(0), toMs: z.number().int().min(0) });

export const cutupFilterSchema = z.object({
  sessionIds: z.array(idSchema).max(50).optional(),
  conceptIds: z.array(idSchema).max(50).optional(),
  frontIds: z.array(idSchema).max(50).optional(),
  playerId: idSchema.optional(),
  /** With playerId: only snaps where his final grade marked this component minus (or plus). */
  component: z.enum(['assignment', 'footwork', 'hands', 'padLevel', 'effort']).optional(),
  mark: z.enum(['plus', 'minus']).optional(),
  angle: z.enum(['sideline', 'end_zone', 'other']).optional(),
  limit: z.number().int().min(1).max(200).default(100),
});
export type CutupFilter = z.infer<typeof cutupFilterSchema>;

export const cutupCreateSchema = z.object({
  teamId: idSchema,
  title: z.string().trim().min(1, 'Give the cut-up a title.').max(120),
  description: z.string().max(1000).optional(),
  filter: cutupFilterSchema.optional(),
  clipIds: z.array(idSchema).max(200).optional(),
});
export const cutupUpdateSchema = z.object({
  title: z.string().trim().min(1).max(120).optional(),
  description: z.string().max(1000).nullable().optional(),
  items: z.array(z.object({ clipId: idSchema, note: z.string().max(500).nullable().optional() })).max(200).optional(),
});
export const cutupShareSchema = z.object({
  playerIds: z.array(idSchema).max(60).default([]),
  groups: z.array(z.enum(POSITION_GROUPS)).max(7).default([]),
});

export const mailPreferencesSchema = z.object({
  coachingDigest: z.boolean(),
  digestEveryHours: z.union([z.literal(1), z.literal(3), z.literal(24)]),
  weeklySummary: z.boolean(),
});
export type MailPreferences = z.infer<typeof mailPreferencesSchema>;
