import { z } from 'zod';

/** What GET /api/dev/mail answers in development: the mail the SMTP fake captured, newest first. */
export const devMailResponseSchema = z.object({
  messages: z.array(
    z.object({ to: z.string(), subject: z.string(), text: z.string(), html: z.string().optional(), date: z.string() }),
  ),
});
export type DevMailResponse = z.infer<typeof devMailResponseSchema>;
