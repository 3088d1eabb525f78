import { z } from 'zod';
import { idParams, idSchema, isoDate, teamParams } from '@shared/api/common';
import { ROLES, STAFF_ROLES, type Role } from '@shared/roles';
import type { AppContext } from '../core/context';
import { forbidden, validationFailed } from '../core/errors';
import { defineRoute, teamFromPath, type RouteDefinition, type TeamMembership } from '../core/route';
import { teamSharing } from '../teams/teams.service';
import { graderAgreement } from './agreement.service';
import { comparePlayers } from './comparison.service';
import { assertOwnPlayer, playerDevelopment, playerTeam } from './development.service';
import { addGoal, addNote, updateGoal } from './goals.service';
import { lineDashboard, readinessMatrix } from './readiness.service';

const coaches: readonly Role[] = ['admin', 'coordinator', 'coach'];
const seasonQuery = z.object({ seasonId: idSchema.optional() });
const intervalSchema = z.tuple([z.number(), z.number()]).nullable();
const rateShape = z.object({ snaps: z.number(), plus: z.number(), rate: z.number().nullable(), interval: intervalSchema });

const developmentSchema = z.object({
  playerId: z.number(),
  sessions: z.array(z.object({ sessionId: z.number(), date: z.string(), snaps: z.number(), plus: z.number(), rate: z.number().nullable(), interval: intervalSchema })),
  overall: rateShape,
  components: z.record(z.string(), rateShape),
  trend: z.object({ slopePerWeek: z.number().nullable(), reading: z.string() }),
});

/** Players see unit-level numbers only when the staff has turned sharing on. */
async function assertUnitVisible(app: AppContext, membership: TeamMembership): Promise<void> {
  if (membership.role !== 'player') return;
  if (!(await teamSharing(app, membership.teamId)).unitWithPlayers) throw forbidden('Your staff has not shared the line\'s numbers with players.');
}

/** The team of the first player in ?players=…; the service checks that all are on that team. */
async function teamOfComparedPlayers(app: AppContext, _params: unknown, req: { query: Record<string, unknown> }): Promise<number | null> {
  const first = String(req.query.players ?? '').split(',')[0];
  if (!first || !/^\d+$/.test(first)) throw validationFailed('Say which players to compare.', { players: 'Two to four player ids, comma-separated.' });
  return playerTeam(app, { id: Number(first) });
}

export function developmentRoutes(): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'playerDevelopment',
      method: 'get',
      path: '/players/{id}/development',
      summary: "A player's development in a season: sessions with intervals, components, the weekly trend and its reading, splits, goals and notes. A player sees only his own.",
      tags: ['development'],
      access: { kind: 'team', roles: ROLES, team: playerTeam },
      params: idParams,
      query: seasonQuery,
      responses: { 200: { description: 'Development', schema: developmentSchema } },
      handler: async ({ app, params, query, membership }) => {
        assertOwnPlayer(membership!, params.id);
        return playerDevelopment(app, params.id, query.seasonId);
      },
    }),
    defineRoute({
      operationId: 'addPlayerGoal',
      method: 'post',
      path: '/players/{id}/goals',
      summary: 'Set a goal for a player: a component (or overall), a target plus rate, a date.',
      tags: ['development'],
      access: { kind: 'team', roles: coaches, team: playerTeam },
      params: idParams,
      body: z.object({
        component: z.enum(['overall', 'assignment', 'footwork', 'hands', 'padLevel', 'effort']),
        target: z.number().gt(0).max(1),
        dueOn: isoDate.optional(),
        note: z.string().max(500).optional(),
      }),
      responses: { 200: { description: 'The goals' } },
      handler: async ({ app, params, body, user }) => addGoal(app, user!.id, params.id, body),
    }),
    defineRoute({
      operationId: 'updatePlayerGoal',
      method: 'patch',
      path: '/players/{id}/goals/{goalId}',
      summary: 'Mark a goal achieved, or change its target, date or note.',
      tags: ['development'],
      access: { kind: 'team', roles: coaches, team: playerTeam },
      params: z.object({ id: idSchema, goalId: idSchema }),
      body: z.object({ achieved: z.boolean().optional(), target: z.number().gt(0).max(1).optional(), dueOn: isoDate.nullable().optional(), note: z.string().max(500).nullable().optional() }),
      responses: { 200: { description: 'The goals' } },
      handler: async ({ app, params, body }) => updateGoal(app, params.id, params.goalId, body),
    }),
    defineRoute({
      operationId: 'addPlayerNote',
      method: 'post',
      path: '/players/{id}/notes',
      summary: "A coach's note on a player's development (kept over time).",
      tags: ['development'],
      access: { kind: 'team', roles: coaches, team: playerTeam },
      params: idParams,
      body: z.object({ body: z.string().trim().min(1).max(2000) }),
      responses: { 200: { description: 'The notes' } },
      handler: async ({ app, params, body, user }) => addNote(app, user!.id, params.id, body.body),
    }),
    defineRoute({
      operationId: 'comparePlayers',
      method: 'get',
      path: '/comparisons',
      summary: 'Two to four players side by side: plus rate with interval, the z test and P(A better) for each pair, with a plain reading.',
      tags: ['development'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamOfComparedPlayers },
      query: z.object({
        players: z
          .string()
          .regex(/^\d+(,\d+){1,3}$/, 'Two to four player ids, comma-separated.')
          .transform((s) => s.split(',').map(Number)),
        seasonId: idSchema.optional(),
      }),
      responses: { 200: { description: 'The comparison' } },
      handler: async ({ app, query, membership }) => comparePlayers(app, membership!.teamId, query.players, query.seasonId),
    }),
    defineRoute({
      operationId: 'graderAgreement',
      method: 'get',
      path: '/teams/{teamId}/agreement',
      summary: "Cohen's kappa per component between two graders over the snaps both graded, with their disagreements.",
      tags: ['development'],
      access: { kind: 'team', roles: ['admin', 'coordinator', 'coach'], team: teamFromPath },
      params: teamParams,
      query: z.object({ graderA: idSchema, graderB: idSchema, seasonId: idSchema.optional() }),
      responses: { 200: { description: 'Agreement' } },
      handler: async ({ app, params, query }) => graderAgreement(app, params.teamId, query.graderA, query.graderB, query.seasonId),
    }),
    defineRoute({
      operationId: 'readinessMatrix',
      method: 'get',
      path: '/teams/{teamId}/readiness',
      summary: 'Concepts × fronts: reps (game and practice) and plus rate per cell, with few-rep and low-rate cells marked.',
      tags: ['development'],
      access: { kind: 'team', roles: ROLES, team: teamFromPath },
      params: teamParams,
      query: seasonQuery,
      responses: { 200: { description: 'The matrix' } },
      handler: async ({ app, params, query, membership }) => {
        await assertUnitVisible(app, membership!);
        return readinessMatrix(app, params.teamId, query.seasonId);
      },
    }),
    defineRoute({
      operationId: 'lineDashboard',
      method: 'get',
      path: '/teams/{teamId}/line-dashboard',
      summary: 'The line by game: unit grade, and missed assignments by position and reason.',
      tags: ['development'],
      access: { kind: 'team', roles: ROLES, team: teamFromPath },
      params: teamParams,
      query: seasonQuery,
      responses: { 200: { description: 'The dashboard' } },
      handler: async ({ app, params, query, membership }) => {
        await assertUnitVisible(app, membership!);
        return lineDashboard(app, params.teamId, query.seasonId);
      },
    }),
  ];
}
