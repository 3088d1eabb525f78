import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { PlayerListResponse } from '@shared/api/roster';
import { ROLE_LABELS, isStaff } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { TeamStore } from '../../core/team/team-store';
import { greetingFor } from './greeting';

/**
 * This Week, the home page. For now it shows only what the API knows: the team, its current season and,
 * for staff, the roster size. Grading progress and study status come with the issues that add them.
 */
@Component({
  selector: 'tw-this-week-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatIconModule, RouterLink, StatePanel],
  templateUrl: './this-week-page.html',
  styleUrl: './this-week-page.scss',
})
export class ThisWeekPage {
  protected readonly auth = inject(AuthStore);
  protected readonly teams = inject(TeamStore);
  protected readonly roleLabels = ROLE_LABELS;

  protected readonly isStaff = computed(() => {
    const role = this.auth.role();
    return role !== null && isStaff(role);
  });
  protected readonly isAdmin = computed(() => this.auth.role() === 'admin');
  protected readonly firstName = computed(() => (this.auth.user()?.name ?? '').trim().split(/\s+/)[0] ?? '');
  protected readonly greeting = computed(() => greetingFor(new Date().getHours()));

  /** Staff only: players cannot read the roster. */
  protected readonly roster = httpResource<PlayerListResponse>(() => {
    const teamId = this.auth.teamId();
    const season = this.teams.currentSeason();
    if (teamId === null || !this.isStaff() || !season) return undefined;
    return { url: `/api/teams/${teamId}/players`, params: { seasonId: season.id }, context: inlineErrors() };
  });

  protected readonly rosterCounts = computed(() => {
    if (!this.roster.hasValue()) return null;
    const players = this.roster.value().players;
    return {
      active: players.filter((p) => p.status === 'active').length,
      injured: players.filter((p) => p.status === 'injured').length,
    };
  });
}
