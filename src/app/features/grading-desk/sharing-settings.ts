import { ChangeDetectionStrategy, Component, inject, linkedSignal, signal } from '@angular/core';
import { MatSlideToggleChange, MatSlideToggleModule } from '@angular/material/slide-toggle';
import type { TeamSharing } from '@shared/api/team';
import { AuthStore } from '../../core/auth/auth-store';
import { Notifier } from '../../core/feedback/notifier';
import { readApiError } from '../../core/http/api-error';
import { TeamStore } from '../../core/team/team-store';

const SWITCHES: { key: keyof TeamSharing; label: string; on: string; off: string }[] = [
  {
    key: 'gradesWithPlayers',
    label: 'Players see their own grades',
    on: 'Each player sees his grade on every snap in his Study Queue and his own Grade Sheet of each session. Never another player\'s.',
    off: 'Players see their clips and coaching points, without grades.',
  },
  {
    key: 'unitWithPlayers',
    label: "Players see the line's numbers",
    on: 'Players may open the Readiness Grid and the unit grade by game, read only. No player\'s own grades are in them.',
    off: 'The Readiness Grid and the unit grade stay with the staff.',
  },
];

/** The team's two sharing switches (admins and coordinators). Each saves at once; no scheme version. */
@Component({
  selector: 'tw-sharing-settings',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatSlideToggleModule],
  template: `
    <fieldset class="tw-card">
      <legend>Sharing with players</legend>
      <p class="hint">Takes effect at once for every player of the team; it is not part of the scheme's versions.</p>
      @if (state(); as s) {
        @for (sw of switches; track sw.key) {
          <div class="switch">
            <mat-slide-toggle [checked]="s[sw.key]" [disabled]="saving() === sw.key" (change)="set(sw.key, $event)" [attr.data-testid]="'share-' + sw.key">
              {{ s[sw.key] ? 'On' : 'Off' }}: {{ sw.label }}
            </mat-slide-toggle>
            <p class="hint">{{ s[sw.key] ? sw.on : sw.off }}</p>
          </div>
        }
      } @else if (teams.team.error()) {
        <p class="error" role="alert">The sharing settings could not be read. Reload the page to try again.</p>
      } @else {
        <p class="hint" role="status">Loading the sharing settings…</p>
      }
    </fieldset>
  `,
  styles: `
    fieldset {
      margin: 0;
      legend {
        font: var(--mat-sys-title-small);
        padding: 0 4px;
      }
    }
    .switch {
      margin: 8px 0;
    }
    .hint {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
      margin: 2px 0 0;
    }
    .error {
      color: var(--mat-sys-error);
    }
  `,
})
export class SharingSettings {
  private readonly auth = inject(AuthStore);
  protected readonly teams = inject(TeamStore);
  private readonly notifier = inject(Notifier);
  protected readonly switches = SWITCHES;

  /** Shown at once when switched; set back when the save fails. */
  protected readonly state = linkedSignal<TeamSharing | null>(() => this.teams.sharing());
  protected readonly saving = signal<keyof TeamSharing | null>(null);

  protected set(key: keyof TeamSharing, change: MatSlideToggleChange): void {
    const teamId = this.auth.teamId();
    const before = this.state();
    const value = change.checked;
    if (teamId === null || before === null) return;
    this.state.set({ ...before, [key]: value });
    this.saving.set(key);
    this.teams.saveSharing(teamId, { [key]: value }).subscribe({
      next: (sharing) => {
        this.saving.set(null);
        this.state.set(sharing);
        this.notifier.info(`${SWITCHES.find((s) => s.key === key)!.label}: ${sharing[key] ? 'on' : 'off'}.`);
      },
      error: (failure: unknown) => {
        this.saving.set(null);
        this.state.set(before);
        // The toggle moved itself on the click; the binding alone may not see a value come back.
        change.source.checked = before[key];
        this.notifier.error(`Not changed: ${readApiError(failure).message}`);
      },
    });
  }
}
