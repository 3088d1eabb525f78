import { z } from 'zod';
import { ANGLES, CLIP_KINDS, CLIP_STATES, DIRECTIONS, FIELD_SIDES, HASHES, PERSONNEL_PATTERN, SESSION_KINDS, TAG_LIST_KINDS } from '../film';
import { idSchema, isoDate } from './common';

// A game may be created before its opponent is known (an upload made from the bus on the way home):
// the API takes it without one; the New session dialog asks for it.
export const filmSessionCreateSchema = z
  .object({
    teamId: idSchema,
    kind: z.enum(SESSION_KINDS, { message: 'Kind is game, scrimmage or practice.' }),
    title: z.string().trim().min(1, 'Enter a title.').max(120),
    date: isoDate,
    seasonId: idSchema.optional(),
    opponent: z.string().trim().max(120).nullish(),
    homeAway: z.enum(['home', 'away', 'neutral']).nullish(),
    week: z.number().int().min(0).max(25).nullish(),
    periods: z.array(z.string().trim().min(1).max(60)).max(40).optional(),
  });
export type FilmSessionCreate = z.infer<typeof filmSessionCreateSchema>;

export const filmSessionUpdateSchema = z.object({
  title: z.string().trim().min(1).max(120).optional(),
  date: isoDate.optional(),
  opponent: z.string().trim().max(120).nullish(),
  homeAway: z.enum(['home', 'away', 'neutral']).nullish(),
  week: z.number().int().min(0).max(25).nullish(),
  periods: z.array(z.string().trim().min(1).max(60)).max(40).optional(),
});

export const clipCountsSchema = z.object({ received: z.number(), processing: z.number(), ready: z.number(), failed: z.number() });

export const filmSessionSchema = z.object({
  id: z.number().int(),
  teamId: z.number().int(),
  seasonId: z.number().int(),
  kind: z.enum(SESSION_KINDS),
  title: z.string(),
  date: z.string(),
  opponent: z.string().nullable(),
  homeAway: z.enum(['home', 'away', 'neutral']).nullable(),
  week: z.number().int().nullable(),
  periods: z.array(z.string()),
  snapCount: z.number().int(),
  clipCounts: clipCountsSchema,
  posterUrl: z.string().nullable(),
});
export type FilmSession = z.infer<typeof filmSessionSchema>;

export const filmSessionListQuerySchema = z.object({
  teamId: idSchema,
  seasonId: idSchema.optional(),
  kind: z.enum(SESSION_KINDS).optional(),
});

export const stripLayoutSchema = z.object({ frames: z.number(), intervalMs: z.number(), tileWidth: z.number(), tileHeight: z.number() });

export const clipSchema = z.object({
  id: z.number().int(),
  sessionId: z.number().int(),
  snapId: z.number().int().nullable(),
  kind: z.enum(CLIP_KINDS),
  angle: z.enum(ANGLES),
  originalName: z.string(),
  status: z.enum(CLIP_STATES),
  failureReason: z.string().nullable(),
  progress: z.number(),
  durationMs: z.number().nullable(),
  width: z.number().nullable(),
  height: z.number().nullable(),
  fps: z.number().nullable(),
  sizeBytes: z.number().nullable(),
  posterUrl: z.string().nullable(),
  playbackUrl: z.string().nullable(),
  stripUrl: z.string().nullable(),
  strip: stripLayoutSchema.nullable(),
  proposedCutsMs: z.array(z.number()).nullable(),
  /** A failed clip whose file was stored can be processed again (a file refused on upload cannot). */
  canRetry: z.boolean(),
  /** A tape already cut into snap clips. */
  splitDone: z.boolean(),
  createdAt: z.string(),
});
export type Clip = z.infer<typeof clipSchema>;

const emptyAsMissing = (v: unknown) => (v === '' ? undefined : v);

/** The text fields of a clip upload (multipart; send them before the files). */
export const uploadFieldsSchema = z.object({
  angle: z.preprocess(emptyAsMissing, z.enum(ANGLES, { message: `Angle is one of ${ANGLES.join(', ')}.` }).default('sideline')),
  kind: z.preprocess(emptyAsMissing, z.enum(CLIP_KINDS, { message: 'Kind is snap or tape.' }).default('snap')),
});

/** The multipart body as the OpenAPI document shows it: the fields, then one or more parts named "files". */
export const uploadFormSchema = uploadFieldsSchema.extend({
  files: z.array(z.string().describe('a video file (binary part)')).min(1).describe('one part per file, each named "files"'),
});

export const uploadResponseSchema = z.object({
  clips: z.array(z.object({ id: z.number().int(), status: z.enum(CLIP_STATES), originalName: z.string(), snapId: z.number().int().nullable() })),
  skipped: z.array(z.object({ originalName: z.string(), reason: z.string(), duplicateOfClipId: z.number().int().optional() })),
});
export type UploadResponse = z.infer<typeof uploadResponseSchema>;

const nullableInt = (min: number, max: number, message: string) => z.number().int(message).min(min, message).max(max, message).nullable();

/** The play data of a snap (Snap Tags). Every field may be left empty. */
export const snapTagsSchema = z.object({
  quarter: nullableInt(1, 5, 'Quarter is 1–4, or 5 for overtime.'),
  down: nullableInt(1, 4, 'Down is 1–4.'),
  distance: nullableInt(0, 99, 'Distance is 0–99 yards.'),
  yardLine: nullableInt(1, 50, 'Yard line is 1–50.'),
  fieldSide: z.enum(FIELD_SIDES).nullable(),
  hash: z.enum(HASHES).nullable(),
  personnel: z.string().regex(PERSONNEL_PATTERN, 'Personnel is two digits: backs, then tight ends (e.g. 11).').nullable(),
  formationId: z.number().int().nullable(),
  conceptId: z.number().int().nullable(),
  direction: z.enum(DIRECTIONS).nullable(),
  frontId: z.number().int().nullable(),
  resultYards: nullableInt(-99, 99, 'Result is −99 to 99 yards.'),
  outcomeId: z.number().int().nullable(),
  period: z.string().max(60).nullable(),
  notes: z.string().max(2000).nullable(),
});
export type SnapTags = z.infer<typeof snapTagsSchema>;
export const snapTagsUpdateSchema = snapTagsSchema.partial();
export type SnapTagsUpdate = z.infer<typeof snapTagsUpdateSchema>;

export const snapSchema = snapTagsSchema.extend({
  id: z.number().int(),
  sessionId: z.number().int(),
  order: z.number().int(),
  clips: z.array(z.object({ id: z.number().int(), angle: z.enum(ANGLES), status: z.enum(CLIP_STATES), posterUrl: z.string().nullable() })),
});
export type Snap = z.infer<typeof snapSchema>;

export const snapBulkUpdateSchema = z.object({
  snapIds: z.array(idSchema).min(1).max(500),
  tags: snapTagsUpdateSchema,
});

export const snapCreateSchema = z.object({ order: z.number().int().min(1).optional() });

export const tagListItemSchema = z.object({ id: z.number().int(), kind: z.enum(TAG_LIST_KINDS), name: z.string(), active: z.boolean() });
export type TagListItem = z.infer<typeof tagListItemSchema>;
export const tagListCreateSchema = z.object({ kind: z.enum(TAG_LIST_KINDS), name: z.string().trim().min(1).max(60) });

export const tapeCutsSchema = z.object({
  cutsMs: z.array(z.number().int().min(0)).max(400),
});
export const tapeDetectSchema = z.object({ threshold: z.number().min(0.05).max(0.95).default(0.3) });

export const snapsCsvImportSchema = z.object({ csv: z.string().max(2_000_000) });
