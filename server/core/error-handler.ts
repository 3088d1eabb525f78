import { randomUUID } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { ZodError } from 'zod';
import { AppError } from './errors';
import type { Logger } from './logger';
import { isDatabaseUnavailable } from './pg-errors';
import { fieldErrors } from './validation';

interface HttpLikeError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
}

/**
 * The one error middleware: every failure becomes {"error":{"code","message","fields"?,"requestId"}}.
 * No stack trace or SQL reaches the client; unexpected errors are logged with the request id.
 */
export function errorHandler(logger: Logger) {
  return (error: unknown, req: Request, res: Response, _next: NextFunction): void => {
    const requestId = (req as { id?: string }).id ?? randomUUID();
    const send = (status: number, code: string, message: string, extra: Record<string, unknown> = {}) => {
      if (res.headersSent) {
        // Cut a half-sent answer off, so the client cannot take it for whole. An answer already
        // complete stays as it is: express-session reports a failed session touch or save after
        // res.end (the database going away mid-request), and destroying then would only kill the
        // keep-alive connection under the client's next request.
        if (!res.writableEnded) res.destroy();
        return;
      }
      res.status(status).set('Cache-Control', 'no-store').json({ error: { code, message, ...extra, requestId } });
    };
    if (error instanceof AppError) {
      send(error.status, error.code, error.message, { ...(error.fields ? { fields: error.fields } : {}), ...(error.extra ?? {}) });
      return;
    }
    if (error instanceof ZodError) {
      send(422, 'validation_failed', 'Some fields need attention.', { fields: fieldErrors(error) });
      return;
    }
    const http = error as HttpLikeError;
    if (http?.type === 'entity.parse.failed') return send(400, 'bad_request', 'The request body is not valid JSON.');
    if (http?.type === 'entity.too.large') return send(413, 'payload_too_large', 'The request body is too large.');
    if (http?.type === 'encoding.unsupported' || http?.type === 'charset.unsupported') return send(415, 'unsupported_media', 'Unsupported request encoding.');
    const status = http?.status ?? http?.statusCode;
    if (status && status >= 400 && status < 500 && http.expose !== false) return send(status, 'bad_request', 'The request could not be understood.');
    const pgCode = (error as { code?: string })?.code;
    if (pgCode === '22021' || pgCode === '22P05') {
      return send(422, 'validation_failed', 'Some text contains a character that cannot be stored (for example a NUL character).');
    }
    // 22008 datetime_field_overflow, 22007 invalid_datetime_format: a date that fits the ISO pattern
    // but not the calendar PostgreSQL keeps (year 0000 has no day at all). Only client dates reach SQL as text.
    if (pgCode === '22008' || pgCode === '22007') {
      return send(422, 'validation_failed', 'A date is outside the range that can be stored. Use a date like 2026-09-04.');
    }
    if (isDatabaseUnavailable(error)) {
      logger.error({ event: 'database_unavailable', requestId, err: error }, 'database unavailable');
      // After the answer has gone out (a failed session touch, see send) a header cannot be set: doing so threw here.
      if (!res.headersSent) res.set('Retry-After', '5');
      return send(503, 'service_unavailable', 'The service is briefly unavailable. Your work is safe; try again in a moment.');
    }
    logger.error({ requestId, err: error, method: req.method, path: req.path }, 'unexpected error');
    send(500, 'internal', 'Something went wrong on our side. It has been logged.');
  };
}
