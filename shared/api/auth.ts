import { z } from 'zod';
import { ROLES } from '../roles';
import { PASSWORD_MAX_LENGTH } from '../passwords';
import { emailSchema } from './common';

export const loginRequestSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(PASSWORD_MAX_LENGTH),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const userSchema = z.object({ id: z.number().int(), email: z.string(), name: z.string() });
export type User = z.infer<typeof userSchema>;

export const membershipSchema = z.object({
  teamId: z.number().int(),
  teamName: z.string(),
  role: z.enum(ROLES),
  playerId: z.number().int().optional(),
});
export type Membership = z.infer<typeof membershipSchema>;

export const meResponseSchema = z.object({ user: userSchema, memberships: z.array(membershipSchema) });
export type MeResponse = z.infer<typeof meResponseSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema });

/** New passwords are checked against the policy in shared/passwords.ts by the service. */
export const newPasswordSchema = z.string().max(PASSWORD_MAX_LENGTH, `Use at most ${PASSWORD_MAX_LENGTH} characters.`);

export const passwordResetConfirmSchema = z.object({
  token: z.string().min(16).max(200),
  password: newPasswordSchema,
});

export const invitationPreviewSchema = z.object({
  email: z.string(),
  teamName: z.string(),
  role: z.enum(ROLES),
  playerName: z.string().optional(),
  hasAccount: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const invitationAcceptSchema = z.object({
  token: z.string().min(16).max(200),
  /** Required for a new account; an existing account keeps its name. */
  name: z.string().trim().max(120).optional(),
  password: newPasswordSchema,
});
export type InvitationAccept = z.infer<typeof invitationAcceptSchema>;
