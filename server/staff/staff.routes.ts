import {
  invitationCreateSchema,
  invitationParams,
  invitationSchema,
  memberParams,
  memberSchema,
  memberUpdateSchema,
  staffResponseSchema,
} from '@shared/api/team';
import { teamParams } from '@shared/api/common';
import { defineRoute, Reply, teamFromPath, type RouteDefinition } from '../core/route';
import { createInvitation, resendInvitation, revokeInvitation } from './invitations.service';
import { describeStaff, updateMember } from './staff.service';

const adminsOnly = { kind: 'team', roles: ['admin'], team: teamFromPath } as const;

export function staffRoutes(): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'listStaff',
      method: 'get',
      path: '/teams/{teamId}/staff',
      summary: "The team's members with their roles, and pending invitations.",
      tags: ['staff'],
      access: adminsOnly,
      params: teamParams,
      responses: { 200: { description: 'Members and invitations', schema: staffResponseSchema } },
      handler: async ({ app, params }) => describeStaff(app, params.teamId),
    }),
    defineRoute({
      operationId: 'createInvitation',
      method: 'post',
      path: '/teams/{teamId}/invitations',
      summary: 'Invite a person by e-mail with a role (players: linked to a roster entry).',
      tags: ['staff'],
      access: adminsOnly,
      params: teamParams,
      body: invitationCreateSchema,
      responses: { 201: { description: 'Invitation created and mailed', schema: invitationSchema }, 409: { description: 'Already a member or already invited' } },
      handler: async ({ app, params, body, user }) => createInvitation(app, user!, params.teamId, body),
    }),
    defineRoute({
      operationId: 'resendInvitation',
      method: 'post',
      path: '/teams/{teamId}/invitations/{invitationId}/resend',
      summary: 'Send a pending invitation again with a fresh link.',
      tags: ['staff'],
      access: adminsOnly,
      params: invitationParams,
      responses: { 200: { description: 'Sent again', schema: invitationSchema } },
      handler: async ({ app, params, user }) => resendInvitation(app, user!, params.teamId, params.invitationId),
    }),
    defineRoute({
      operationId: 'revokeInvitation',
      method: 'delete',
      path: '/teams/{teamId}/invitations/{invitationId}',
      summary: 'Revoke a pending invitation; its link stops working.',
      tags: ['staff'],
      access: adminsOnly,
      params: invitationParams,
      responses: { 204: { description: 'Revoked' } },
      handler: async ({ app, params }) => {
        await revokeInvitation(app, params.teamId, params.invitationId);
        return new Reply(204);
      },
    }),
    defineRoute({
      operationId: 'updateMember',
      method: 'patch',
      path: '/teams/{teamId}/members/{membershipId}',
      summary: "Change a member's role, or deactivate / reactivate them (nothing is deleted).",
      tags: ['staff'],
      access: adminsOnly,
      params: memberParams,
      body: memberUpdateSchema,
      responses: { 200: { description: 'The member', schema: memberSchema }, 409: { description: 'Would leave the team without an admin' } },
      handler: async ({ app, params, body, membership }) => updateMember(app, params.teamId, membership!.id, params.membershipId, body),
    }),
  ];
}
