import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { inlineErrors } from '../http/inline-errors';

/**
 * Whether the API runs in development and has /api/dev/mail (404 in production). A 503 still counts:
 * the route exists and the page then explains that the local mailbox is not answering.
 */
@Injectable({ providedIn: 'root' })
export class DevMailProbe {
  private readonly http = inject(HttpClient);
  private answer: Promise<boolean> | null = null;
  readonly available = signal(false);

  check(): Promise<boolean> {
    this.answer ??= firstValueFrom(this.http.get('/api/dev/mail', { context: inlineErrors() })).then(
      () => true,
      (failure: unknown) => failure instanceof HttpErrorResponse && failure.status !== 404 && failure.status !== 0,
    ).then((ok) => {
      this.available.set(ok);
      return ok;
    });
    return this.answer;
  }
}
