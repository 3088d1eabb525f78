import type { NextFunction, Request, Response } from 'express';
import { validationFailed } from './errors';

/** The first top-level field whose value holds a NUL character anywhere inside, or null. */
export function fieldWithNul(value: unknown, field = '_'): string | null {
  if (typeof value === 'string') return value.includes('\u0000') ? field : null;
  if (Array.isArray(value)) {
    for (const item of value) if (fieldWithNul(item, field)) return field;
    return null;
  }
  if (value && typeof value === 'object') {
    for (const [key, inner] of Object.entries(value)) {
      const found = fieldWithNul(inner, field === '_' ? key : field);
      if (found) return found;
    }
  }
  return null;
}

/** PostgreSQL cannot store NUL in text: refuse it up front as a field error instead of failing later. */
export function rejectNulCharacters(req: Request, _res: Response, next: NextFunction): void {
  const field = fieldWithNul(req.body);
  if (field) return next(validationFailed('Some text contains a NUL character, which cannot be stored.', { [field]: 'Remove the NUL character.' }));
  next();
}
