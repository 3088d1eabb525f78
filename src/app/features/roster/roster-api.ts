import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Player, PlayerInput, PlayerUpdate } from '@shared/api/roster';
import { inlineErrors } from '../../core/http/inline-errors';

export interface RosterImportCounts {
  imported: number;
  updated: number;
}

/** Roster writes. Reads go through httpResource in the pages. */
@Injectable({ providedIn: 'root' })
export class RosterApi {
  private readonly http = inject(HttpClient);

  /** Errors come back to the dialog, which shows them next to the fields. */
  create(teamId: number, input: PlayerInput & { seasonId?: number }): Observable<Player> {
    return this.http.post<Player>(`/api/teams/${teamId}/players`, input, { context: inlineErrors() });
  }

  update(teamId: number, playerId: number, change: PlayerUpdate, inline = true): Observable<Player> {
    return this.http.patch<Player>(`/api/teams/${teamId}/players/${playerId}`, change, inline ? { context: inlineErrors() } : {});
  }

  import(teamId: number, csv: string, seasonId: number | null): Observable<RosterImportCounts> {
    const body = seasonId === null ? { csv } : { csv, seasonId };
    return this.http.post<RosterImportCounts>(`/api/teams/${teamId}/players/import`, body, { context: inlineErrors() });
  }

  exportUrl(teamId: number, seasonId: number | null): string {
    const params = seasonId === null ? '' : `?${new HttpParams().set('seasonId', seasonId).toString()}`;
    return `/api/teams/${teamId}/players/export.csv${params}`;
  }
}
