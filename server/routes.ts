import { authRoutes } from './auth/auth.routes';
import { devRoutes } from './dev/dev.routes';
import { filmRoutes } from './film/film.routes';
import { gradingRoutes } from './grading/grading.routes';
import { filmRoomRoutes } from './film-room/film-room.routes';
import { developmentRoutes } from './development/development.routes';
import { thisWeekRoutes } from './this-week/this-week.routes';
import { healthRoutes } from './health/health.routes';
import { rosterRoutes } from './roster/roster.routes';
import { staffRoutes } from './staff/staff.routes';
import { teamRoutes } from './teams/teams.routes';
import type { RouteDefinition } from './core/route';

type AuthDeps = Parameters<typeof authRoutes>[0];

/** Every API route of the product, in one list: mounted by app.ts and described by the OpenAPI document. */
export function allRoutes(deps: AuthDeps & { version: string; startedAt: number }): RouteDefinition[] {
  return [
    ...healthRoutes(deps.version, deps.startedAt),
    ...authRoutes(deps),
    ...teamRoutes(),
    ...rosterRoutes(),
    ...staffRoutes(),
    ...filmRoutes(),
    ...gradingRoutes(),
    ...filmRoomRoutes(),
    ...developmentRoutes(),
    ...thisWeekRoutes(),
    ...devRoutes(),
  ];
}
