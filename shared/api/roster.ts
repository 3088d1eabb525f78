import { z } from 'zod';
import { CLASS_YEARS, JERSEY_MAX, JERSEY_MIN, PLAYER_STATUSES, POSITIONS } from '../roster';
import { idSchema } from './common';

export const playerSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  jersey: z.number().int(),
  positions: z.array(z.enum(POSITIONS)),
  classYear: z.enum(CLASS_YEARS),
  redshirt: z.boolean(),
  heightIn: z.number().int().nullable(),
  weightLb: z.number().int().nullable(),
  status: z.enum(PLAYER_STATUSES),
  seasonId: z.number().int(),
  /** The account linked to this roster entry, when the player has signed in. */
  accountEmail: z.string().nullable(),
});
export type Player = z.infer<typeof playerSchema>;

export const playerListQuerySchema = z.object({
  seasonId: idSchema.optional(),
});

export const playerListResponseSchema = z.object({ players: z.array(playerSchema), seasonId: z.number().int() });
export type PlayerListResponse = z.infer<typeof playerListResponseSchema>;

const jerseySchema = z.coerce
  .number({ message: 'Jersey must be a number.' })
  .int('Jersey must be a whole number.')
  .min(JERSEY_MIN, `Jersey must be ${JERSEY_MIN}–${JERSEY_MAX}.`)
  .max(JERSEY_MAX, `Jersey must be ${JERSEY_MIN}–${JERSEY_MAX}.`);

// Field rules without defaults: the update schema is these fields, each optional, and must never
// fill in a default for a field the request did not send.
const playerFields = {
  name: z.string().trim().min(1, 'Enter a name.').max(120, 'Keep the name under 120 characters.'),
  jersey: jerseySchema,
  positions: z
    .array(z.enum(POSITIONS, { message: `Positions are ${POSITIONS.join(', ')}.` }))
    .min(1, 'List at least one position.')
    .max(POSITIONS.length)
    .refine((list) => new Set(list).size === list.length, 'A position is listed twice.'),
  classYear: z.enum(CLASS_YEARS, { message: `Class year is one of ${CLASS_YEARS.join(', ')}.` }),
  redshirt: z.boolean(),
  heightIn: z.number().int().min(48, 'Height looks wrong.').max(96, 'Height looks wrong.').nullable(),
  weightLb: z.number().int().min(100, 'Weight looks wrong.').max(500, 'Weight looks wrong.').nullable(),
  status: z.enum(PLAYER_STATUSES, { message: `Status is one of ${PLAYER_STATUSES.join(', ')}.` }),
};

export const playerInputSchema = z.object({
  ...playerFields,
  redshirt: playerFields.redshirt.default(false),
  heightIn: playerFields.heightIn.default(null),
  weightLb: playerFields.weightLb.default(null),
  status: playerFields.status.default('active'),
});
export type PlayerInput = z.infer<typeof playerInputSchema>;

export const playerCreateSchema = playerInputSchema.extend({ seasonId: idSchema.optional() });
export const playerUpdateSchema = z.object(playerFields).partial();
export type PlayerUpdate = z.infer<typeof playerUpdateSchema>;

export const playerParams = z.object({ teamId: idSchema, playerId: idSchema });

export const rosterImportRequestSchema = z.object({
  seasonId: idSchema.optional(),
  csv: z.string().max(1_000_000, 'The file is larger than 1 MB.'),
});

export const rosterImportRowErrorSchema = z.object({
  row: z.number().int(),
  field: z.string(),
  message: z.string(),
});
export type RosterImportRowError = z.infer<typeof rosterImportRowErrorSchema>;

export const rosterImportResponseSchema = z.object({
  imported: z.number().int(),
  updated: z.number().int(),
});
