import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CutupFilter } from '@shared/api/film-room';
import type { PositionGroup } from '@shared/film-room';
import { inlineErrors } from '../../core/http/inline-errors';

export interface CutupSummary {
  id: number;
  title: string;
  description: string | null;
  updatedAt: string;
}

export interface CutupItem {
  position: number;
  clipId: number;
  note: string | null;
  angle: string;
  sessionTitle: string;
  snapOrder: number | null;
  posterUrl: string | null;
  playbackUrl: string | null;
}

export interface Cutup {
  id: number;
  teamId: number;
  title: string;
  description: string | null;
  filter: CutupFilter | null;
  items: CutupItem[];
  sharedWith: { playerIds: number[]; groups: PositionGroup[] };
}

export interface PreviewClip {
  clipId: number;
  sessionId: number;
  sessionTitle: string;
  sessionDate: string;
  snapOrder: number | null;
  angle: string;
  posterUrl: string | null;
}

/** What the filter form sends: the schema's input, where the server fills in the limit. */
export type CutupFilterInput = Omit<CutupFilter, 'limit'> & { limit?: number };

@Injectable({ providedIn: 'root' })
export class CutupsApi {
  private readonly http = inject(HttpClient);

  listUrl(teamId: number): string {
    return `/api/teams/${teamId}/cutups`;
  }

  cutupUrl(cutupId: number): string {
    return `/api/cutups/${cutupId}`;
  }

  preview(teamId: number, filter: CutupFilterInput): Observable<{ clips: PreviewClip[] }> {
    return this.http.post<{ clips: PreviewClip[] }>('/api/cutups/preview', { teamId, filter }, { context: inlineErrors() });
  }

  create(input: { teamId: number; title: string; description?: string; clipIds: number[] }): Observable<Cutup> {
    return this.http.post<Cutup>('/api/cutups', input, { context: inlineErrors() });
  }

  update(cutupId: number, change: { title?: string; description?: string | null; items?: { clipId: number; note?: string | null }[] }): Observable<Cutup> {
    return this.http.patch<Cutup>(`/api/cutups/${cutupId}`, change, { context: inlineErrors() });
  }

  share(cutupId: number, share: { playerIds: number[]; groups: PositionGroup[] }): Observable<Cutup> {
    return this.http.put<Cutup>(`/api/cutups/${cutupId}/shares`, share, { context: inlineErrors() });
  }
}
