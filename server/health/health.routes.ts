import { sql } from 'kysely';
import { z } from 'zod';
import { defineRoute, Reply, type RouteDefinition } from '../core/route';
import { checkReadiness } from './readiness';

const healthSchema = z.object({ status: z.enum(['ok', 'degraded']), database: z.enum(['ok', 'unavailable']), uptimeSeconds: z.number(), version: z.string() });
const checkState = z.enum(['ok', 'missing', 'unavailable']);
const readinessSchema = z.object({
  status: z.enum(['ready', 'not_ready']),
  checks: z.object({ database: checkState, jobQueue: checkState, objectStore: checkState }),
});

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
    defineRoute({
      operationId: 'ready',
      method: 'get',
      path: '/ready',
      summary:
        'Readiness for traffic: 200 when the database answers, the job queue schema holds every queue and the object store bucket can be listed; ' +
        '503 naming the part that failed (ok | missing | unavailable per check). Details go to the log, not the answer.',
      tags: ['health'],
      access: { kind: 'public' },
      responses: { 200: { description: 'Ready', schema: readinessSchema }, 503: { description: 'Not ready: see checks' } },
      handler: async ({ app, res }) => {
        const { ready, checks } = await checkReadiness(app);
        if (ready) return new Reply(200, { status: 'ready', checks });
        const failed = Object.entries(checks).filter(([, state]) => state !== 'ok').map(([part, state]) => `${part} ${state}`);
        res.set('Retry-After', '5');
        return new Reply(503, { status: 'not_ready', checks, error: { code: 'service_unavailable', message: `Not ready: ${failed.join(', ')}.` } });
      },
    }),
  ];
}
