import { sql } from 'kysely';
import { z } from 'zod';
import { defineRoute, Reply, type RouteDefinition } from '../core/route';

const healthSchema = z.object({ status: z.enum(['ok', 'degraded']), database: z.enum(['ok', 'unavailable']), uptimeSeconds: z.number(), version: z.string() });

export function healthRoutes(version: string, startedAt: number): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'health',
      method: 'get',
      path: '/health',
      summary: 'Liveness and the database state: 200 when the database answers, 503 otherwise.',
      tags: ['health'],
      access: { kind: 'public' },
      responses: { 200: { description: 'Healthy', schema: healthSchema }, 503: { description: 'The database does not answer' } },
      handler: async ({ app }) => {
        const database = await sql`select 1`
          .execute(app.db)
          .then(() => 'ok' as const)
          .catch(() => 'unavailable' as const);
        const body = { status: database === 'ok' ? 'ok' : 'degraded', database, uptimeSeconds: Math.round((Date.now() - startedAt) / 1000), version };
        return new Reply(database === 'ok' ? 200 : 503, body);
      },
    }),
  ];
}
