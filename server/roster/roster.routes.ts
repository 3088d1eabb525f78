import { z } from 'zod';
import { idSchema, teamParams } from '@shared/api/common';
import {
  playerCreateSchema,
  playerListQuerySchema,
  playerListResponseSchema,
  playerParams,
  playerSchema,
  playerUpdateSchema,
  rosterImportRequestSchema,
  rosterImportResponseSchema,
} from '@shared/api/roster';
import { ROSTER_EDITOR_ROLES, STAFF_ROLES } from '@shared/roles';
import { defineRoute, teamFromPath, type RouteDefinition } from '../core/route';
import { addPlayer, exportRoster, importRoster, listPlayers, updatePlayer } from './roster.service';

const staff = { kind: 'team', roles: STAFF_ROLES, team: teamFromPath } as const;
const editors = { kind: 'team', roles: ROSTER_EDITOR_ROLES, team: teamFromPath } as const;

export function rosterRoutes(): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'listPlayers',
      method: 'get',
      path: '/teams/{teamId}/players',
      summary: "The season's roster (default: the current season), inactive players included.",
      tags: ['roster'],
      access: staff,
      params: teamParams,
      query: playerListQuerySchema,
      responses: { 200: { description: 'The roster', schema: playerListResponseSchema } },
      handler: async ({ app, params, query }) => listPlayers(app, params.teamId, query.seasonId),
    }),
    defineRoute({
      operationId: 'exportRoster',
      method: 'get',
      path: '/teams/{teamId}/players/export.csv',
      summary: 'The roster as a CSV file (columns name, jersey, positions, class, redshirt, height, weight, status).',
      tags: ['roster'],
      access: staff,
      params: teamParams,
      query: playerListQuerySchema,
      responses: { 200: { description: 'CSV file', contentType: 'text/csv' } },
      handler: async ({ app, params, query, res }) => {
        const { filename, csv } = await exportRoster(app, params.teamId, query.seasonId);
        res.set('Content-Type', 'text/csv; charset=utf-8');
        res.set('Content-Disposition', `attachment; filename="${filename}"`);
        res.status(200).send(csv);
      },
    }),
    defineRoute({
      operationId: 'addPlayer',
      method: 'post',
      path: '/teams/{teamId}/players',
      summary: 'Add a player to a season roster (default: current season).',
      tags: ['roster'],
      access: editors,
      params: teamParams,
      body: playerCreateSchema,
      responses: { 201: { description: 'The player', schema: playerSchema }, 409: { description: 'Jersey already taken' }, 422: { description: 'Invalid fields' } },
      handler: async ({ app, params, body }) => addPlayer(app, params.teamId, body),
    }),
    defineRoute({
      operationId: 'updatePlayer',
      method: 'patch',
      path: '/teams/{teamId}/players/{playerId}',
      summary: "Edit a player's roster entry; deactivate with status inactive (nothing is deleted).",
      tags: ['roster'],
      access: editors,
      params: playerParams,
      query: z.object({ seasonId: idSchema.optional() }),
      body: playerUpdateSchema,
      responses: { 200: { description: 'The player', schema: playerSchema }, 409: { description: 'Jersey already taken' } },
      handler: async ({ app, params, query, body }) => updatePlayer(app, params.teamId, params.playerId, body, query.seasonId),
    }),
    defineRoute({
      operationId: 'importRoster',
      method: 'post',
      path: '/teams/{teamId}/players/import',
      summary: 'Import a roster CSV, all or nothing: any bad row is reported by number and column and nothing is imported.',
      tags: ['roster'],
      access: editors,
      params: teamParams,
      body: rosterImportRequestSchema,
      responses: { 200: { description: 'Counts', schema: rosterImportResponseSchema }, 422: { description: 'Rows with problems (error.rows)' } },
      handler: async ({ app, params, body }) => importRoster(app, params.teamId, body.csv, body.seasonId),
    }),
  ];
}
