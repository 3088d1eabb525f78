import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { inlineErrors } from '../http/inline-errors';

/** Whether the API runs in development and answers /api/dev/mail (it is 404 in production). */
@Injectable({ providedIn: 'root' })
export class DevMailProbe {
  private readonly http = inject(HttpClient);
  private answer: Promise<boolean> | null = null;
  readonly available = signal(false);

  check(): Promise<boolean> {
    this.answer ??= firstValueFrom(this.http.get('/api/dev/mail', { context: inlineErrors() })).then(
      () => true,
      () => false,
    ).then((ok) => {
      this.available.set(ok);
      return ok;
    });
    return this.answer;
  }
}
