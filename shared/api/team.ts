import { z } from 'zod';
import { ROLES } from '../roles';
import { emailSchema, idSchema, isoDate } from './common';

export const seasonSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  startsOn: z.string(),
  endsOn: z.string(),
  isCurrent: z.boolean(),
});
export type Season = z.infer<typeof seasonSchema>;

/** What the staff shares with players: each his own grades, and the line's unit-level numbers. */
export const teamSharingSchema = z.object({ gradesWithPlayers: z.boolean(), unitWithPlayers: z.boolean() });
export type TeamSharing = z.infer<typeof teamSharingSchema>;
/** PATCH /api/teams/{teamId}/sharing: either switch, or both; an empty body changes nothing. */
export const teamSharingUpdateSchema = teamSharingSchema.partial();

export const teamSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  seasons: z.array(seasonSchema),
  currentSeasonId: z.number().int().nullable(),
  sharing: teamSharingSchema,
});
export type Team = z.infer<typeof teamSchema>;

export const seasonCreateSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter a name.').max(60),
    startsOn: isoDate,
    endsOn: isoDate,
    makeCurrent: z.boolean().default(false),
  })
  .refine((s) => s.startsOn <= s.endsOn, { message: 'The season ends before it starts.', path: ['endsOn'] });

export const memberSchema = z.object({
  membershipId: z.number().int(),
  userId: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  playerId: z.number().int().nullable(),
  active: z.boolean(),
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const invitationSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  role: z.enum(ROLES),
  playerId: z.number().int().nullable(),
  invitedBy: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
  lastSentAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;

export const staffResponseSchema = z.object({
  members: z.array(memberSchema),
  invitations: z.array(invitationSchema),
});
export type StaffResponse = z.infer<typeof staffResponseSchema>;

export const invitationCreateSchema = z
  .object({
    email: emailSchema,
    role: z.enum(ROLES),
    playerId: idSchema.optional(),
  })
  .refine((i) => i.role !== 'player' || i.playerId !== undefined, {
    message: 'Choose the roster entry this player account belongs to.',
    path: ['playerId'],
  });
export type InvitationCreate = z.infer<typeof invitationCreateSchema>;

export const memberUpdateSchema = z
  .object({ role: z.enum(ROLES).optional(), active: z.boolean().optional() })
  .refine((m) => m.role !== undefined || m.active !== undefined, { message: 'Nothing to change.' });

export const memberParams = z.object({ teamId: idSchema, membershipId: idSchema });
export const invitationParams = z.object({ teamId: idSchema, invitationId: idSchema });
