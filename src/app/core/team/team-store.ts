import { HttpClient, httpResource } from '@angular/common/http';
import { Injectable, computed, inject } from '@angular/core';
import { Observable, tap } from 'rxjs';
import type { Season, Team, TeamSharing } from '@shared/api/team';
import { AuthStore } from '../auth/auth-store';
import { inlineErrors } from '../http/inline-errors';

/** The selected team with its seasons; follows the team switcher. */
@Injectable({ providedIn: 'root' })
export class TeamStore {
  private readonly auth = inject(AuthStore);
  private readonly http = inject(HttpClient);

  readonly team = httpResource<Team>(() => {
    const teamId = this.auth.teamId();
    return teamId === null ? undefined : { url: `/api/teams/${teamId}`, context: inlineErrors() };
  });

  readonly seasons = computed<Season[]>(() => (this.team.hasValue() ? this.team.value().seasons : []));

  readonly currentSeason = computed<Season | null>(() => {
    if (!this.team.hasValue()) return null;
    const team = this.team.value();
    return team.seasons.find((s) => s.id === team.currentSeasonId) ?? null;
  });

  /** What the staff shares with players; null until the team has loaded. */
  readonly sharing = computed<TeamSharing | null>(() => (this.team.hasValue() ? this.team.value().sharing : null));

  /** Turns a sharing switch (admins and coordinators); the team document follows the answer. */
  saveSharing(teamId: number, change: Partial<TeamSharing>): Observable<TeamSharing> {
    return this.http.patch<TeamSharing>(`/api/teams/${teamId}/sharing`, change, { context: inlineErrors() }).pipe(
      tap((sharing) => {
        if (this.team.hasValue() && this.team.value().id === teamId) this.team.set({ ...this.team.value(), sharing });
      }),
    );
  }
}
