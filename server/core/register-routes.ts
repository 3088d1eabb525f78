import { Router } from 'express';
import type { AppContext } from './context';
import { authorize } from './authorize';
import { Reply, type RouteDefinition, type SessionUser } from './route';
import { parseOrThrow } from './validation';

/** OpenAPI '{teamId}' → Express ':teamId'. */
export function expressPath(openApiPath: string): string {
  return openApiPath.replace(/\{(\w+)\}/g, ':$1');
}

function successStatus(route: RouteDefinition): number {
  const status = Object.keys(route.responses).map(Number).find((s) => s >= 200 && s < 300);
  return status ?? 200;
}

/**
 * Mounts route definitions on an Express router. Per request: parse the path, authorize, parse the
 * query and body, run the handler, send what it returned. Express 5 forwards rejections to the error handler.
 */
export function buildRouter(app: AppContext, routes: RouteDefinition[]): Router {
  const router = Router();
  for (const route of routes) {
    if (route.developmentOnly && app.config.env === 'production') continue;
    const status = successStatus(route);
    router[route.method](expressPath(route.path), async (req, res) => {
      const params = route.params ? parseOrThrow(route.params, req.params, 'params') : {};
      const membership = await authorize(app, req, route.access, params, route.operationId);
      const query = route.query ? parseOrThrow(route.query, req.query, 'query') : {};
      const body = route.body ? parseOrThrow(route.body, req.body ?? {}, 'body') : undefined;
      const user = (req.user as SessionUser | undefined) ?? null;
      const result = await route.handler({ app, req, res, params, query, body, user, membership });
      if (res.headersSent) return;
      if (result instanceof Reply) {
        if (result.body === undefined) res.status(result.status).end();
        else res.status(result.status).json(result.body);
      } else if (result === undefined) {
        res.status(status === 200 ? 204 : status).end();
      } else {
        res.status(status).json(result);
      }
    });
  }
  return router;
}
