import type { ErrorCode } from '@shared/errors';

/** A domain error with a stable code; the error middleware turns it into the JSON error shape. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) => new AppError(400, 'bad_request', message, fields);
export const validationFailed = (message: string, fields?: Record<string, string>, extra?: Record<string, unknown>) =>
  new AppError(422, 'validation_failed', message, fields, extra);
export const unauthenticated = (message = 'Sign in to continue.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'You do not have access to this.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'That item') => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, fields?: Record<string, string>) => new AppError(409, 'conflict', message, fields);
export const tokenInvalid = (message = 'This link is invalid or has expired. Ask for a new one.') =>
  new AppError(400, 'token_invalid', message);
