import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { CutupSummary, CutupsApi } from './cutups-api';

/** The team's cut-ups, last changed first. */
@Component({
  selector: 'tw-cutup-list-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatIconModule, RouterLink, StatePanel],
  template: `
    <div class="tw-page tw-dense">
      <header class="tw-page-header">
        <h1>Cut-ups</h1>
        <div class="tw-actions">
          <a mat-flat-button routerLink="/cutups/new"><mat-icon aria-hidden="true">add</mat-icon> New cut-up</a>
        </div>
      </header>
      <p class="intro">A cut-up is a reel of clips picked for a lesson (every minus on pad level, every snap against a bear front), played straight through with a note per clip.</p>

      <tw-state-panel
        [resource]="list"
        loadingLabel="Loading cut-ups…"
        emptyMessage="No cut-ups yet. Start one with “New cut-up”."
        [empty]="cutups().length === 0"
        (retry)="list.reload()"
      />
      @if (list.hasValue() && cutups().length > 0) {
        <ul class="cutups">
          @for (c of cutups(); track c.id) {
            <li class="tw-card" data-testid="cutup-row">
              <div class="text">
                <a class="title" [routerLink]="['/cutups', c.id]">{{ c.title }}</a>
                @if (c.description) {
                  <span class="description">{{ c.description }}</span>
                }
                <span class="when">Changed {{ c.updatedAt | date: 'd MMM y, HH:mm' }}</span>
              </div>
              <div class="tw-actions">
                <a mat-stroked-button [routerLink]="['/cutups', c.id, 'play']" [attr.aria-label]="'Play ' + c.title"><mat-icon aria-hidden="true">play_arrow</mat-icon> Play</a>
                <a mat-button [routerLink]="['/cutups', c.id]" [attr.aria-label]="'Edit ' + c.title">Edit</a>
              </div>
            </li>
          }
        </ul>
      }
    </div>
  `,
  styles: `
    .intro {
      margin: 0 0 16px;
      color: var(--mat-sys-on-surface-variant);
    }
    .cutups {
      list-style: none;
      margin: 0;
      padding: 0;
      display: grid;
      gap: 8px;
    }
    li {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px;
    }
    .text {
      display: flex;
      flex-direction: column;
      gap: 2px;
    }
    .title {
      font: var(--mat-sys-title-medium);
    }
    .description,
    .when {
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class CutupListPage {
  private readonly auth = inject(AuthStore);
  private readonly api = inject(CutupsApi);

  protected readonly list = httpResource<{ cutups: CutupSummary[] }>(() => {
    const teamId = this.auth.teamId();
    return teamId === null ? undefined : { url: this.api.listUrl(teamId), context: inlineErrors() };
  });
  protected readonly cutups = computed(() => (this.list.hasValue() ? this.list.value().cutups : []));
}
