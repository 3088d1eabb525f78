import { teamParams } from '@shared/api/common';
import { STAFF_ROLES } from '@shared/roles';
import { defineRoute, teamFromPath, type RouteDefinition } from '../core/route';
import { thisWeek } from './this-week.service';

export function thisWeekRoutes(): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'thisWeek',
      method: 'get',
      path: '/teams/{teamId}/this-week',
      summary: 'The staff home page: the next game, grading progress of the last one, and who has not caught up on his coaching points.',
      tags: ['this week'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamFromPath },
      params: teamParams,
      responses: { 200: { description: 'This week' } },
      handler: async ({ app, params }) => thisWeek(app, params.teamId),
    }),
  ];
}
