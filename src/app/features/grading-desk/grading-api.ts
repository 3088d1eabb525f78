import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Grade, GradeInput, GradingProgress, Scheme, SchemeInput } from '@shared/api/grading';
import type { Position } from '@shared/roster';
import { inlineErrors } from '../../core/http/inline-errors';

export interface Participant {
  playerId: number;
  position: Position;
}

/** Grading writes and the reads that are not page resources. The desk shows every failure itself. */
@Injectable({ providedIn: 'root' })
export class GradingApi {
  private readonly http = inject(HttpClient);

  saveGrade(snapId: number, playerId: number, body: GradeInput): Observable<Grade> {
    return this.http.put<Grade>(`/api/snaps/${snapId}/grades/${playerId}`, body, { context: inlineErrors() });
  }

  saveParticipants(snapId: number, participants: readonly Participant[]): Observable<{ participants: Participant[] }> {
    return this.http.put<{ participants: Participant[] }>(`/api/snaps/${snapId}/participants`, { participants }, { context: inlineErrors() });
  }

  snapGrades(snapId: number): Observable<{ grades: Grade[] }> {
    return this.http.get<{ grades: Grade[] }>(`/api/snaps/${snapId}/grades`, { context: inlineErrors() });
  }

  setLock(sessionId: number, locked: boolean, reason?: string): Observable<GradingProgress> {
    const body = locked ? { locked } : { locked, reason };
    return this.http.post<GradingProgress>(`/api/film-sessions/${sessionId}/grading-lock`, body, { context: inlineErrors() });
  }

  saveScheme(teamId: number, input: SchemeInput): Observable<Scheme> {
    return this.http.put<Scheme>(`/api/teams/${teamId}/grading-scheme`, input, { context: inlineErrors() });
  }
}
