/**
 * Stable error codes of the API. Every error response is
 * `{"error":{"code","message","fields"?}}` with one of these codes.
 */
export const ERROR_CODES = [
  'bad_request',
  'validation_failed',
  'unauthenticated',
  'invalid_credentials',
  'forbidden',
  'csrf_rejected',
  'not_found',
  'conflict',
  'stale_version',
  'too_many_requests',
  'payload_too_large',
  'unsupported_media',
  'token_invalid',
  'service_unavailable',
  'internal',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];

export interface ApiErrorBody {
  error: {
    code: ErrorCode;
    message: string;
    fields?: Record<string, string>;
    /** Row-level problems of a file import: nothing was imported. */
    rows?: { row: number; field: string; message: string }[];
    requestId?: string;
  };
}

export function isApiErrorBody(value: unknown): value is ApiErrorBody {
  return (
    typeof value === 'object' &&
    value !== null &&
    'error' in value &&
    typeof (value as ApiErrorBody).error?.code === 'string'
  );
}
