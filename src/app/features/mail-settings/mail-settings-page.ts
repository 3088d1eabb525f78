import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, effect, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatRadioModule } from '@angular/material/radio';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import type { MailPreferences } from '@shared/api/film-room';
import { Notifier } from '../../core/feedback/notifier';
import { StatePanel } from '../../core/feedback/state-panel';
import { readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { MAIL_PREFERENCES_URL, MailApi } from './mail-api';

const EVERY: { hours: MailPreferences['digestEveryHours']; label: string }[] = [
  { hours: 1, label: 'At most every hour' },
  { hours: 3, label: 'At most every 3 hours' },
  { hours: 24, label: 'Once a day' },
];

/** Which mails Trenchwork sends this account, and how often. Account mails always go. */
@Component({
  selector: 'tw-mail-settings-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatRadioModule, MatSlideToggleModule, StatePanel],
  template: `
    <div class="tw-page settings">
      <header class="tw-page-header">
        <h1>Mail settings</h1>
      </header>
      <tw-state-panel [resource]="stored" loadingLabel="Loading your mail settings…" (retry)="stored.reload()" />

      @if (draft(); as d) {
        <form class="tw-card" (submit)="$event.preventDefault(); save()">
          <section aria-labelledby="digest-title">
            <h2 id="digest-title">New coaching points</h2>
            <p class="explain">One mail that collects the coaching points written for you, with a link to each moment. While it is off, points are not saved up for a later mail; they stay in your Study Queue.</p>
            <mat-slide-toggle [checked]="d.coachingDigest" (change)="change({ coachingDigest: $event.checked })">
              {{ d.coachingDigest ? 'On' : 'Off' }}: mail me new coaching points
            </mat-slide-toggle>
            <mat-radio-group
              class="every"
              aria-label="How often"
              [value]="d.digestEveryHours"
              [disabled]="!d.coachingDigest"
              (change)="change({ digestEveryHours: $event.value })"
            >
              @for (option of every; track option.hours) {
                <mat-radio-button [value]="option.hours">{{ option.label }}</mat-radio-button>
              }
            </mat-radio-group>
          </section>

          <section aria-labelledby="weekly-title">
            <h2 id="weekly-title">Weekly summary</h2>
            <p class="explain">On Mondays: your plus rate in each graded session this season, and your open goals.</p>
            <mat-slide-toggle [checked]="d.weeklySummary" (change)="change({ weeklySummary: $event.checked })">
              {{ d.weeklySummary ? 'On' : 'Off' }}: mail me the weekly summary
            </mat-slide-toggle>
          </section>

          <p class="always">Invitations and password resets always come: they are how you get into your account.</p>

          @if (problem(); as text) {
            <div class="tw-alert tw-alert-error" role="alert">
              <mat-icon aria-hidden="true">error_outline</mat-icon>
              <p>{{ text }}</p>
            </div>
          }
          <div class="tw-actions">
            <button mat-flat-button type="submit" [disabled]="saving() || !dirty()">{{ saving() ? 'Saving…' : 'Save' }}</button>
            @if (!dirty() && savedOnce()) {
              <span class="saved" role="status"><mat-icon aria-hidden="true">check</mat-icon> Saved</span>
            }
          </div>
        </form>
      }
    </div>
  `,
  styles: `
    .settings {
      max-width: 640px;
    }
    form {
      display: flex;
      flex-direction: column;
      gap: 20px;
    }
    h2 {
      margin: 0 0 4px;
      font: var(--mat-sys-title-medium);
    }
    .explain,
    .always {
      margin: 0 0 8px;
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    mat-slide-toggle {
      display: block;
      min-height: 48px;
    }
    .every {
      display: flex;
      flex-direction: column;
      margin-left: 8px;
    }
    .saved {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      color: var(--tw-field-green);
      font-weight: 600;
    }
  `,
})
export class MailSettingsPage {
  private readonly api = inject(MailApi);
  private readonly notifier = inject(Notifier);

  protected readonly every = EVERY;
  protected readonly stored = httpResource<MailPreferences>(() => ({ url: MAIL_PREFERENCES_URL, context: inlineErrors() }));
  protected readonly draft = signal<MailPreferences | null>(null);
  protected readonly dirty = signal(false);
  protected readonly saving = signal(false);
  protected readonly savedOnce = signal(false);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    effect(() => {
      if (this.stored.hasValue() && !this.dirty()) this.draft.set(this.stored.value());
    });
  }

  protected change(part: Partial<MailPreferences>): void {
    this.draft.update((d) => (d ? { ...d, ...part } : d));
    this.dirty.set(true);
  }

  protected save(): void {
    const draft = this.draft();
    if (!draft) return;
    this.saving.set(true);
    this.problem.set(null);
    this.api.save(draft).subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.stored.set(saved);
        this.dirty.set(false);
        this.savedOnce.set(true);
        this.notifier.info('Mail settings saved.');
      },
      error: (failure: unknown) => {
        this.saving.set(false);
        this.problem.set(readApiError(failure).message);
      },
    });
  }
}
