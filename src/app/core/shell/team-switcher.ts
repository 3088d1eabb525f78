import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { Router } from '@angular/router';
import { ROLE_LABELS } from '@shared/roles';
import { AuthStore } from '../auth/auth-store';
import { urlAllowedFor } from './nav-links';

/** Shows the selected team; with several teams it becomes a menu to switch between them. */
@Component({
  selector: 'tw-team-switcher',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatMenuModule],
  template: `
    @let current = auth.membership();
    @if (current) {
      @if (auth.memberships().length > 1) {
        <button
          mat-button
          class="switch"
          type="button"
          [matMenuTriggerFor]="teams"
          [attr.aria-label]="'Team: ' + current.teamName + '. Switch team'"
        >
          <span class="name">{{ current.teamName }}</span>
          <mat-icon iconPositionEnd aria-hidden="true">arrow_drop_down</mat-icon>
        </button>
        <mat-menu #teams="matMenu">
          @for (m of auth.memberships(); track m.teamId) {
            <button
              mat-menu-item
              type="button"
              role="menuitemradio"
              [attr.aria-checked]="m.teamId === current.teamId"
              (click)="choose(m.teamId)"
            >
              <mat-icon aria-hidden="true">{{ m.teamId === current.teamId ? 'radio_button_checked' : 'radio_button_unchecked' }}</mat-icon>
              <span>{{ m.teamName }} · {{ roleLabels[m.role] }}</span>
            </button>
          }
        </mat-menu>
      } @else {
        <span class="name single">{{ current.teamName }}</span>
      }
    }
  `,
  styles: `
    :host {
      display: inline-flex;
      min-width: 0;
    }
    .switch {
      color: inherit;
      max-width: 100%;
    }
    .name {
      display: block;
      max-width: min(32vw, 280px);
      overflow: hidden;
      text-overflow: ellipsis;
      white-space: nowrap;
      font: var(--mat-sys-title-small);
    }
    .single {
      padding: 0 8px;
    }
  `,
})
export class TeamSwitcher {
  protected readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  protected readonly roleLabels = ROLE_LABELS;

  protected choose(teamId: number): void {
    this.auth.selectTeam(teamId);
    // Stay on the page when the new role may see it (pages follow the selected team), else go home.
    if (!urlAllowedFor(this.auth.role(), this.router.url)) void this.router.navigateByUrl('/');
  }
}
