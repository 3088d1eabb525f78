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

interface ThisWeekSummary {
  nextGame: { sessionId: number; title: string; date: string; opponent: string | null; homeAway: string | null; week: number | null } | null;
  lastGame: { sessionId: number; title: string; date: string; opponent: string | null; expectedCells: number; finalCells: number; locked: boolean } | null;
  study: { sessionId: number; playersWithPoints: number; notCaughtUp: { playerId: number; name: string; jersey: number | null; points: number; acknowledged: number; watched: number; clips: number }[] } | null;
}

interface MyQueue {
  clips: { clipId: number; comments: { acknowledged: boolean }[] }[];
}

/**
 * This Week, the home page. Staff: the next opponent, how far grading of the last game has come,
 * and who has not caught up on his coaching points. Players: how many points wait in the study queue.
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

  protected readonly summary = httpResource<ThisWeekSummary>(() => {
    const teamId = this.auth.teamId();
    if (teamId === null || !this.isStaff()) return undefined;
    return { url: `/api/teams/${teamId}/this-week`, context: inlineErrors() };
  });

  protected readonly gradingShare = computed(() => {
    const last = this.summary.hasValue() ? this.summary.value().lastGame : null;
    if (!last || last.expectedCells === 0) return null;
    return Math.min(100, Math.round((100 * last.finalCells) / last.expectedCells));
  });

  /** Players: points in the queue not yet acknowledged. */
  protected readonly queue = httpResource<MyQueue>(() => (this.auth.role() === 'player' ? { url: '/api/me/clips', context: inlineErrors() } : undefined));
  protected readonly openPoints = computed(() => {
    if (!this.queue.hasValue()) return null;
    return this.queue.value().clips.reduce((n, c) => n + c.comments.filter((p) => !p.acknowledged).length, 0);
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
