import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import { inlineErrors } from '../../core/http/inline-errors';
import type { CoachNote, Goal, GoalComponent } from './development-types';

export interface GoalInput {
  component: GoalComponent;
  /** 0–1, like every rate in the API. */
  target: number;
  dueOn?: string;
  note?: string;
}

/** Progress writes (coaches only). The page reads through httpResource and shows write errors inline. */
@Injectable({ providedIn: 'root' })
export class ProgressApi {
  private readonly http = inject(HttpClient);

  addGoal(playerId: number, input: GoalInput): Observable<{ goals: Goal[] }> {
    return this.http.post<{ goals: Goal[] }>(`/api/players/${playerId}/goals`, input, { context: inlineErrors() });
  }

  setAchieved(playerId: number, goalId: number, achieved: boolean): Observable<{ goals: Goal[] }> {
    return this.http.patch<{ goals: Goal[] }>(`/api/players/${playerId}/goals/${goalId}`, { achieved }, { context: inlineErrors() });
  }

  addNote(playerId: number, body: string): Observable<{ notes: CoachNote[] }> {
    return this.http.post<{ notes: CoachNote[] }>(`/api/players/${playerId}/notes`, { body }, { context: inlineErrors() });
  }
}
