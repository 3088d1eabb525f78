import { Observable, catchError, exhaustMap, map, of, scan, takeWhile, timer } from 'rxjs';
import { ApiError, readApiError } from '../../core/http/api-error';

export const POLL_INTERVAL_MS = 2000;

export interface PollState<T> {
  /** The last good answer (kept while a later poll fails). */
  value: T | null;
  error: ApiError | null;
}

/** Worth asking again: the network dropped, the server is busy or briefly broken. */
function isTransient(error: ApiError | null): boolean {
  return error !== null && (error.status === 0 || error.status === 429 || error.status >= 500);
}

/**
 * Asks now and then every `intervalMs` until the answer is final (every clip ready or failed).
 * Unsubscribing stops it, so a page that leaves stops polling. A slow answer is waited for
 * (exhaustMap) instead of being cancelled by the next tick; lasting errors (403, 404) stop it.
 */
export function pollUntilFinal<T>(fetch: () => Observable<T>, isFinal: (value: T) => boolean, intervalMs = POLL_INTERVAL_MS): Observable<PollState<T>> {
  return timer(0, intervalMs).pipe(
    exhaustMap(() =>
      fetch().pipe(
        map((value): PollState<T> => ({ value, error: null })),
        catchError((failure: unknown) => of<PollState<T>>({ value: null, error: readApiError(failure) })),
      ),
    ),
    takeWhile((state) => (state.value !== null ? !isFinal(state.value) : isTransient(state.error)), true),
    scan((previous: PollState<T>, next: PollState<T>) => (next.value === null ? { value: previous.value, error: next.error } : next), { value: null, error: null }),
  );
}
