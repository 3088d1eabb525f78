import type { NextFunction, Request, Response } from 'express';
import { validationFailed } from './errors';

/**
 * The first top-level field whose value holds a NUL character anywhere inside, or null. Walks with
 * an explicit stack, not recursion: a deeply nested body (a few kilobytes of "[[[[…") must come back
 * as bad input, not overflow the call stack into a 500.
 */
export function fieldWithNul(value: unknown, field = '_'): string | null {
  // [value, the field it counts for, inside an array (an array's items all count for its field)]
  const pending: [unknown, string, boolean][] = [[value, field, false]];
  while (pending.length > 0) {
    const [current, name, inArray] = pending.pop()!;
    if (typeof current === 'string') {
      if (current.includes('\u0000')) return name;
    } else if (Array.isArray(current)) {
      // Pushed in reverse so items are looked at in order, as a recursive walk would.
      for (let i = current.length - 1; i >= 0; i -= 1) pending.push([current[i], name, true]);
    } else if (current && typeof current === 'object') {
      const entries = Object.entries(current);
      for (let i = entries.length - 1; i >= 0; i -= 1) {
        const [key, inner] = entries[i]!;
        pending.push([inner, name === '_' && !inArray ? key : name, inArray]);
      }
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
