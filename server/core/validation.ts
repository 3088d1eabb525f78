import type { ZodError, ZodType, z } from 'zod';
import { AppError, validationFailed } from './errors';

/** Flattens zod issues into one message per field ("positions.1" → "positions"), first issue wins. */
export function fieldErrors(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? String(issue.path[0]) : '_';
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

export function parseOrThrow<S extends ZodType>(schema: S, value: unknown, where: 'body' | 'query' | 'params'): z.output<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  if (where === 'params') throw new AppError(400, 'bad_request', 'The address has an invalid id.', fieldErrors(result.error));
  const fields = fieldErrors(result.error);
  const message = where === 'body' ? 'Some fields need attention.' : 'The query has invalid values.';
  throw validationFailed(message, fields);
}
