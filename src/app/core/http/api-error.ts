import { HttpErrorResponse } from '@angular/common/http';
import type { ErrorCode } from '@shared/errors';
import type { RosterImportRowError } from '@shared/api/roster';

/** What a page needs to know about a failed request, whatever shape the failure took. */
export interface ApiError {
  status: number;
  code: ErrorCode | 'network' | 'unknown';
  message: string;
  fields: Record<string, string>;
  /** Row errors of a rejected roster import (422). */
  rows: RosterImportRowError[];
}

const NETWORK_MESSAGE = 'Cannot reach Trenchwork. Check your connection and try again.';
const FALLBACK_MESSAGE = 'Something went wrong on our side. Try again in a moment.';

/** Reads the API's error shape {"error":{"code","message","fields"?,"rows"?}} out of any thrown value. */
export function readApiError(thrown: unknown): ApiError {
  // Resources may wrap what the request threw; the HTTP response is then the cause.
  const failure = thrown instanceof Error && thrown.cause instanceof HttpErrorResponse ? thrown.cause : thrown;
  if (!(failure instanceof HttpErrorResponse)) {
    return { status: 0, code: 'unknown', message: FALLBACK_MESSAGE, fields: {}, rows: [] };
  }
  if (failure.status === 0) {
    return { status: 0, code: 'network', message: NETWORK_MESSAGE, fields: {}, rows: [] };
  }
  const body = failure.error as { error?: Partial<ApiError> } | null;
  const detail = body && typeof body === 'object' && body.error && typeof body.error === 'object' ? body.error : null;
  return {
    status: failure.status,
    code: (typeof detail?.code === 'string' ? detail.code : 'unknown') as ApiError['code'],
    message: typeof detail?.message === 'string' && detail.message ? detail.message : FALLBACK_MESSAGE,
    fields: isStringRecord(detail?.fields) ? detail.fields : {},
    rows: Array.isArray(detail?.rows) ? detail.rows.filter(isRowError) : [],
  };
}

function isStringRecord(value: unknown): value is Record<string, string> {
  return typeof value === 'object' && value !== null && Object.values(value).every((v) => typeof v === 'string');
}

function isRowError(value: unknown): value is RosterImportRowError {
  const row = value as RosterImportRowError;
  return typeof row === 'object' && row !== null && typeof row.row === 'number' && typeof row.message === 'string';
}

/** A 422 that names the fields at fault, so the form can show each message where it belongs. */
export function hasFieldErrors(error: ApiError): boolean {
  return error.status === 422 && Object.keys(error.fields).length > 0;
}
