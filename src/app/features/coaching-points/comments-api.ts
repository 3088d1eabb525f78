import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { z } from 'zod';
import type { Comment, pointCreateSchema } from '@shared/api/film-room';
import { inlineErrors } from '../../core/http/inline-errors';

/** What the point form sends (POST /api/clips/{id}/comments). */
export type PointCreate = z.input<typeof pointCreateSchema>;

/**
 * Coaching points, questions and replies on a clip. Staff and players use the same endpoints; the
 * server decides who sees and may do what. Callers show their own errors.
 */
@Injectable({ providedIn: 'root' })
export class CommentsApi {
  private readonly http = inject(HttpClient);

  listUrl(clipId: number): string {
    return `/api/clips/${clipId}/comments`;
  }

  createPoint(clipId: number, point: PointCreate): Observable<Comment> {
    return this.http.post<Comment>(`/api/clips/${clipId}/comments`, point, { context: inlineErrors() });
  }

  ask(clipId: number, atMs: number, body: string): Observable<Comment> {
    return this.http.post<Comment>(`/api/clips/${clipId}/questions`, { atMs, body }, { context: inlineErrors() });
  }

  reply(commentId: number, body: string): Observable<Comment> {
    return this.http.post<Comment>(`/api/comments/${commentId}/replies`, { body }, { context: inlineErrors() });
  }

  edit(commentId: number, body: string): Observable<Comment> {
    return this.http.patch<Comment>(`/api/comments/${commentId}`, { body }, { context: inlineErrors() });
  }

  remove(commentId: number): Observable<void> {
    return this.http.delete<void>(`/api/comments/${commentId}`, { context: inlineErrors() });
  }

  acknowledge(commentId: number): Observable<void> {
    return this.http.post<void>(`/api/comments/${commentId}/acknowledge`, {}, { context: inlineErrors() });
  }
}
