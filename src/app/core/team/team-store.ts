import { httpResource } from '@angular/common/http';
import { Injectable, computed, inject } from '@angular/core';
import type { Season, Team } from '@shared/api/team';
import { AuthStore } from '../auth/auth-store';
import { inlineErrors } from '../http/inline-errors';

/** The selected team with its seasons; follows the team switcher. */
@Injectable({ providedIn: 'root' })
export class TeamStore {
  private readonly auth = inject(AuthStore);

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
}
