import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import { inlineErrors } from '../../core/http/inline-errors';

@Injectable({ providedIn: 'root' })
export class GradeSheetApi {
  private readonly http = inject(HttpClient);

  csvUrl(sessionId: number): string {
    return `/api/film-sessions/${sessionId}/grade-sheet.csv`;
  }

  /** 202: the mail is queued, not yet delivered. */
  mail(sessionId: number, playerId: number): Observable<unknown> {
    return this.http.post(`/api/film-sessions/${sessionId}/grade-sheet/mail`, { playerId }, { context: inlineErrors() });
  }
}
