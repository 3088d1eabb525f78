import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import type { PlayerListResponse } from '@shared/api/roster';
import { AuthStore } from '../../core/auth/auth-store';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';

/** Staff pick whose Progress to open: the season's roster, filterable by name, jersey or position. */
@Component({
  selector: 'tw-progress-index-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatFormFieldModule, MatIconModule, MatInputModule, RouterLink, StatePanel],
  template: `
    <div class="tw-page tw-dense">
      <header class="tw-page-header"><h1>Progress</h1></header>
      <p class="intro">Pick a player to see his trends, splits, goals and coach notes.</p>
      <mat-form-field class="filter">
        <mat-label>Find a player</mat-label>
        <input matInput [value]="filter()" (input)="filter.set($any($event.target).value)" />
      </mat-form-field>
      <tw-state-panel [resource]="roster" loadingLabel="Loading the roster…" emptyMessage="No players on this season's roster yet." [empty]="players().length === 0" (retry)="roster.reload()" />
      @if (shown().length > 0) {
        <ul class="list">
          @for (p of shown(); track p.id) {
            <li>
              <a [routerLink]="['/progress', p.id]"><span class="jersey">#{{ p.jersey }}</span> {{ p.name }}</a>
              <span class="pos">{{ p.positions.join(', ') }}</span>
            </li>
          }
        </ul>
      } @else if (players().length > 0) {
        <p>No player matches “{{ filter() }}”.</p>
      }
    </div>
  `,
  styles: `
    .intro {
      margin: 0 0 12px;
      color: var(--mat-sys-on-surface-variant);
    }
    .filter {
      width: min(320px, 100%);
    }
    .list {
      list-style: none;
      margin: 0;
      padding: 0;
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(240px, 1fr));
      gap: 4px 16px;
    }
    li {
      display: flex;
      justify-content: space-between;
      gap: 8px;
      padding: 6px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .jersey {
      font-variant-numeric: tabular-nums;
      font-weight: 600;
    }
    .pos {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class ProgressIndexPage {
  private readonly auth = inject(AuthStore);
  protected readonly filter = signal('');
  protected readonly roster = httpResource<PlayerListResponse>(() => {
    const teamId = this.auth.teamId();
    return teamId === null ? undefined : { url: `/api/teams/${teamId}/players`, context: inlineErrors() };
  });
  protected readonly players = computed(() => (this.roster.hasValue() ? [...this.roster.value().players].sort((a, b) => a.jersey - b.jersey) : []));
  protected readonly shown = computed(() => {
    const q = this.filter().trim().toLowerCase();
    if (!q) return this.players();
    return this.players().filter((p) => p.name.toLowerCase().includes(q) || String(p.jersey) === q || p.positions.some((pos) => pos.toLowerCase() === q));
  });
}
