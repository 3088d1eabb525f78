import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { DepthChart } from '@shared/api/grading';
import type { Position } from '@shared/roster';
import { inlineErrors } from '../../core/http/inline-errors';

export interface DepthChartSave {
  seasonId?: number;
  /** The week saved for (its chart runs until a later week's); omitted: the current week. */
  week?: number;
  /** Only the positions sent are replaced. */
  positions: Partial<Record<Position, number[]>>;
  reason?: string;
}

@Injectable({ providedIn: 'root' })
export class DepthChartApi {
  private readonly http = inject(HttpClient);

  save(teamId: number, body: DepthChartSave): Observable<DepthChart> {
    return this.http.put<DepthChart>(`/api/teams/${teamId}/depth-chart`, body, { context: inlineErrors() });
  }
}
