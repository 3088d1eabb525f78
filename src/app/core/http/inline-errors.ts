import { HttpContext, HttpContextToken } from '@angular/common/http';

/**
 * Marks a request whose caller shows its errors itself (inline, next to the form or list).
 * The error interceptor then stays quiet, except for the sign-in redirect on 401.
 */
export const INLINE_ERRORS = new HttpContextToken<boolean>(() => false);

export function inlineErrors(): HttpContext {
  return new HttpContext().set(INLINE_ERRORS, true);
}
