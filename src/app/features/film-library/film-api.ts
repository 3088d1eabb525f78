import { HttpClient, HttpEvent, HttpRequest } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Clip, FilmSession, FilmSessionCreate, Snap, SnapTagsUpdate, TagListItem, UploadResponse } from '@shared/api/film';
import type { Angle, ClipKind } from '@shared/film';
import { inlineErrors } from '../../core/http/inline-errors';

/** Film writes and the reads that are polled. One-off reads go through httpResource in the pages. */
@Injectable({ providedIn: 'root' })
export class FilmApi {
  private readonly http = inject(HttpClient);

  createSession(input: FilmSessionCreate): Observable<FilmSession> {
    return this.http.post<FilmSession>('/api/film-sessions', input, { context: inlineErrors() });
  }

  /** Polled; the page shows a failed poll itself instead of a snackbar every two seconds. */
  sessionClips(sessionId: number): Observable<{ clips: Clip[] }> {
    return this.http.get<{ clips: Clip[] }>(`/api/film-sessions/${sessionId}/clips`, { context: inlineErrors() });
  }

  clip(clipId: number): Observable<Clip> {
    return this.http.get<Clip>(`/api/clips/${clipId}`, { context: inlineErrors() });
  }

  /**
   * One file per request so each file has its own progress; text fields go first because the
   * server reads them before it streams the file. Unsubscribing cancels the upload.
   */
  upload(sessionId: number, file: File, angle: Angle, kind: ClipKind): Observable<HttpEvent<UploadResponse>> {
    const body = new FormData();
    body.append('angle', angle);
    body.append('kind', kind);
    body.append('files', file, file.name);
    const request = new HttpRequest<FormData>('POST', `/api/film-sessions/${sessionId}/clips`, body, {
      reportProgress: true,
      context: inlineErrors(),
    });
    return this.http.request<UploadResponse>(request);
  }

  retryClip(clipId: number): Observable<Clip> {
    return this.http.post<Clip>(`/api/clips/${clipId}/retry`, {});
  }

  removeClip(clipId: number): Observable<void> {
    return this.http.delete<void>(`/api/clips/${clipId}`);
  }

  placeClip(clipId: number, snapId: number | null): Observable<Clip> {
    return this.http.patch<Clip>(`/api/clips/${clipId}`, { snapId });
  }

  tagLists(teamId: number): Observable<{ items: TagListItem[] }> {
    return this.http.get<{ items: TagListItem[] }>(`/api/teams/${teamId}/tag-lists`, { context: inlineErrors() });
  }

  tagSnap(snapId: number, change: SnapTagsUpdate): Observable<Snap> {
    return this.http.patch<Snap>(`/api/snaps/${snapId}`, change, { context: inlineErrors() });
  }

  tagSnaps(sessionId: number, snapIds: number[], tags: SnapTagsUpdate): Observable<{ snaps: Snap[] }> {
    return this.http.post<{ snaps: Snap[] }>(`/api/film-sessions/${sessionId}/snaps/bulk-tags`, { snapIds, tags }, { context: inlineErrors() });
  }

  importSnapTags(sessionId: number, csv: string): Observable<{ updated: number }> {
    return this.http.post<{ updated: number }>(`/api/film-sessions/${sessionId}/snaps/import`, { csv }, { context: inlineErrors() });
  }

  snapTagsExportUrl(sessionId: number): string {
    return `/api/film-sessions/${sessionId}/snaps/export.csv`;
  }

  detectCuts(clipId: number, threshold: number): Observable<Clip> {
    return this.http.post<Clip>(`/api/clips/${clipId}/detect-cuts`, { threshold }, { context: inlineErrors() });
  }

  splitTape(clipId: number, cutsMs: number[]): Observable<Clip> {
    return this.http.post<Clip>(`/api/clips/${clipId}/split`, { cutsMs }, { context: inlineErrors() });
  }
}
