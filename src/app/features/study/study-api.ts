import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { z } from 'zod';
import type { myClipsSchema } from '@shared/api/film-room';
import { inlineErrors } from '../../core/http/inline-errors';

export type MyClips = z.infer<typeof myClipsSchema>;
export type MyClip = MyClips['clips'][number];
export type MyClipPoint = MyClip['comments'][number];

/** A cut-up shared with the player (GET /api/me/cutups). */
export interface SharedCutup {
  id: number;
  title: string;
  description: string | null;
  updatedAt: string;
}

export const MY_CLIPS_URL = '/api/me/clips';
export const MY_CUTUPS_URL = '/api/me/cutups';

/** His own row of a session's Grade Sheet (the API refuses anyone else's, and all of it while grades are not shared). */
export function myGradeSheetUrl(sessionId: number, playerId: number): string {
  return `/api/film-sessions/${sessionId}/grade-sheet/players/${playerId}`;
}

@Injectable({ providedIn: 'root' })
export class StudyApi {
  private readonly http = inject(HttpClient);

  /** Watched coverage; failures are retried by the caller, never shown. */
  recordView(clipId: number, fromMs: number, toMs: number): Observable<{ watchedFraction: number }> {
    return this.http.post<{ watchedFraction: number }>(`/api/clips/${clipId}/views`, { fromMs, toMs }, { context: inlineErrors() });
  }
}
