import { teamParams } from '@shared/api/common';
import { seasonCreateSchema, seasonSchema, teamSchema, teamSharingSchema, teamSharingUpdateSchema } from '@shared/api/team';
import { ROLES } from '@shared/roles';
import { defineRoute, teamFromPath, type RouteDefinition } from '../core/route';
import { createSeason, describeTeam, setTeamSharing } from './teams.service';

export function teamRoutes(): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'getTeam',
      method: 'get',
      path: '/teams/{teamId}',
      summary: 'The team with its seasons.',
      tags: ['teams'],
      access: { kind: 'team', roles: ROLES, team: teamFromPath },
      params: teamParams,
      responses: { 200: { description: 'The team', schema: teamSchema } },
      handler: async ({ app, params }) => describeTeam(app, params.teamId),
    }),
    defineRoute({
      operationId: 'createSeason',
      method: 'post',
      path: '/teams/{teamId}/seasons',
      summary: 'Add a season (the first one, or one marked so, becomes current).',
      tags: ['teams'],
      access: { kind: 'team', roles: ['admin'], team: teamFromPath },
      params: teamParams,
      body: seasonCreateSchema,
      responses: { 201: { description: 'The season', schema: seasonSchema }, 409: { description: 'Name already used' } },
      handler: async ({ app, params, body }) => createSeason(app, params.teamId, body),
    }),
    defineRoute({
      operationId: 'teamSharing',
      method: 'patch',
      path: '/teams/{teamId}/sharing',
      summary: "Whether players see their own grades, and the line's unit-level numbers. The current switches are in GET /teams/{teamId}.",
      tags: ['teams'],
      access: { kind: 'team', roles: ['admin', 'coordinator'], team: teamFromPath },
      params: teamParams,
      body: teamSharingUpdateSchema,
      responses: { 200: { description: 'The settings', schema: teamSharingSchema } },
      handler: async ({ app, params, body }) => setTeamSharing(app, params.teamId, body),
    }),
  ];
}
