import { devMailResponseSchema, type DevMailResponse } from '@shared/api/mail';
import { AppError } from '../core/errors';
import { defineRoute, type RouteDefinition } from '../core/route';

/** Development-only routes: never mounted when NODE_ENV is production (see register-routes.ts). */
export function devRoutes(): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'devMail',
      method: 'get',
      path: '/dev/mail',
      summary: 'Development only: the mail the local SMTP fake captured, newest first.',
      tags: ['development'],
      access: { kind: 'public' },
      developmentOnly: true,
      responses: { 200: { description: 'Captured mail', schema: devMailResponseSchema }, 503: { description: 'No SMTP fake configured' } },
      handler: async ({ app }) => {
        if (!app.config.devMailboxUrl) throw new AppError(503, 'service_unavailable', 'No local mailbox is configured (DEV_MAILBOX_URL).');
        const response = await fetch(`${app.config.devMailboxUrl.replace(/\/$/, '')}/messages`, { signal: AbortSignal.timeout(3000) });
        if (!response.ok) throw new AppError(503, 'service_unavailable', 'The local mailbox did not answer.');
        const data = (await response.json()) as DevMailResponse;
        return devMailResponseSchema.parse({
          messages: data.messages.map((m) => ({ to: m.to, subject: m.subject, text: m.text, html: m.html, date: m.date })),
        });
      },
    }),
  ];
}
