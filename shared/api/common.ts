import { z } from 'zod';

/** Path ids are positive integers (bigserial on the database side, safe in JS numbers). */
export const idSchema = z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER);
export const idParams = z.object({ id: idSchema });
export const teamParams = z.object({ teamId: idSchema });

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254)
  .pipe(z.email({ message: 'Enter a valid e-mail address.' }));

export const isoDate = z.iso.date({ message: 'Use a date like 2026-09-04.' });

export const errorResponseSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    requestId: z.string().optional(),
  }),
});
