import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { FilmSession } from '@shared/api/film';
import { AuthStore } from '../../core/auth/auth-store';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { TeamStore } from '../../core/team/team-store';

const KIND_LABELS: Record<FilmSession['kind'], string> = { game: 'Game', scrimmage: 'Scrimmage', practice: 'Practice' };

/** Where grading starts: the season's sessions, newest first, each with its desk and its sheet. */
@Component({
  selector: 'tw-grading-sessions-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatIconModule, RouterLink, StatePanel],
  template: `
    <div class="tw-page tw-dense">
      <header class="tw-page-header">
        <h1>Grading Desk</h1>
        @if (canEditScheme()) {
          <a mat-stroked-button routerLink="/grading/scheme"><mat-icon aria-hidden="true">tune</mat-icon> Grading scheme and sharing</a>
        }
      </header>
      <p class="intro">Pick a session to grade. Your grades save as you type and wait in this browser when the connection drops.</p>
      <tw-state-panel [resource]="library" loadingLabel="Loading sessions…" emptyMessage="No film sessions in this season yet." [empty]="sessions().length === 0" (retry)="library.reload()" />
      @if (sessions().length > 0) {
        <ul class="list">
          @for (s of sessions(); track s.id) {
            <li class="tw-card">
              <div class="what">
                <strong>{{ s.title }}</strong>
                <span>{{ kindLabels[s.kind] }} · {{ s.date | date: 'EEE d MMM y' }} · {{ s.snapCount }} {{ s.snapCount === 1 ? 'snap' : 'snaps' }}</span>
              </div>
              <div class="tw-actions">
                <a mat-flat-button [routerLink]="['/grading', s.id]" [attr.aria-label]="'Grade ' + s.title"><mat-icon aria-hidden="true">grading</mat-icon> Grade</a>
                <a mat-stroked-button [routerLink]="['/sheets', s.id]" [attr.aria-label]="'Grade Sheet of ' + s.title">Grade Sheet</a>
              </div>
            </li>
          }
        </ul>
      }
    </div>
  `,
  styles: `
    .intro {
      margin: 0 0 12px;
      color: var(--mat-sys-on-surface-variant);
    }
    .list {
      list-style: none;
      margin: 0;
      padding: 0;
      display: flex;
      flex-direction: column;
      gap: 8px;
    }
    li {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px;
    }
    .what {
      display: flex;
      flex-direction: column;
      span {
        font: var(--mat-sys-body-small);
        color: var(--mat-sys-on-surface-variant);
      }
    }
  `,
})
export class GradingSessionsPage {
  private readonly auth = inject(AuthStore);
  private readonly teams = inject(TeamStore);
  protected readonly kindLabels = KIND_LABELS;
  protected readonly canEditScheme = computed(() => ['admin', 'coordinator'].includes(this.auth.role() ?? ''));

  private readonly seasonId = linkedSignal<number | null>(() => this.teams.currentSeason()?.id ?? null);
  protected readonly library = httpResource<{ sessions: FilmSession[]; seasonId: number }>(() => {
    const teamId = this.auth.teamId();
    if (teamId === null || !this.teams.team.hasValue()) return undefined;
    const seasonId = this.seasonId();
    const params: Record<string, number> = seasonId === null ? { teamId } : { teamId, seasonId };
    return { url: '/api/film-sessions', params, context: inlineErrors() };
  });
  protected readonly sessions = computed(() => {
    const list = this.library.hasValue() ? this.library.value().sessions : [];
    return [...list].sort((a, b) => (a.date === b.date ? b.id - a.id : a.date < b.date ? 1 : -1));
  });
}
