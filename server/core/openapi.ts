import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { errorResponseSchema } from '@shared/api/common';
import type { RouteDefinition } from './route';

/**
 * The OpenAPI 3.1 document of every mounted route, generated from the same zod schemas the routes
 * validate with. `x-access` states who may call each operation (the authorization test reads it to
 * be sure its own table lists every route).
 */
export function buildOpenApiDocument(routes: RouteDefinition[], version: string): object {
  const registry = new OpenAPIRegistry();
  // zod 4 schemas get their methods at construction, so shared schemas are used as they are (no .openapi()).
  const errorRef = errorResponseSchema;
  registry.registerComponent('securitySchemes', 'session', { type: 'apiKey', in: 'cookie', name: 'tw.sid' });
  registry.registerComponent('securitySchemes', 'xsrf', { type: 'apiKey', in: 'header', name: 'X-XSRF-TOKEN' });
  for (const route of routes) {
    const access =
      route.access.kind === 'team' ? { kind: 'team', roles: [...route.access.roles] } : { kind: route.access.kind };
    const responses = Object.fromEntries(
      Object.entries(route.responses).map(([status, r]) => {
        const isError = Number(status) >= 400;
        const schema = r.schema ?? (isError ? errorRef : undefined);
        const content = schema ? { [r.contentType ?? 'application/json']: { schema } } : r.contentType ? { [r.contentType]: { schema: { type: 'string' as const } } } : undefined;
        return [status, { description: r.description, ...(content ? { content } : {}) }];
      }),
    );
    registry.registerPath({
      operationId: route.operationId,
      method: route.method,
      path: `/api${route.path}`,
      summary: route.summary,
      tags: route.tags,
      request: {
        ...(route.params ? { params: route.params as never } : {}),
        ...(route.query ? { query: route.query as never } : {}),
        ...(route.body ? { body: { content: { 'application/json': { schema: route.body } } } } : {}),
        ...(route.multipartBody ? { body: { content: { 'multipart/form-data': { schema: route.multipartBody } } } } : {}),
      },
      responses,
      ...(route.access.kind === 'public' ? {} : { security: [{ session: [] }] }),
      'x-access': access,
      ...(route.developmentOnly ? { 'x-development-only': true } : {}),
    } as Parameters<typeof registry.registerPath>[0]);
  }
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Trenchwork API',
      version,
      description:
        'Film grading and development tracking for an offensive line room. Errors are {"error":{"code","message","fields"?}}. ' +
        'State-changing requests need the X-XSRF-TOKEN header echoing the XSRF-TOKEN cookie that any GET sets.',
    },
    servers: [{ url: '/' }],
  });
}
