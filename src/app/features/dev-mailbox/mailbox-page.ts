import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { DevMailResponse } from '@shared/api/mail';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { linkify } from './linkify';

/** Development only: the mail the API's SMTP fake captured, newest first, so invitations can be followed. */
@Component({
  selector: 'tw-mailbox-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatExpansionModule, MatIconModule, RouterLink, StatePanel],
  template: `
    <div class="tw-page">
      <header class="tw-page-header">
        <h1>Dev mailbox</h1>
        <div class="tw-actions">
          <button mat-stroked-button type="button" (click)="mail.reload()" [disabled]="mail.isLoading()">
            <mat-icon aria-hidden="true">refresh</mat-icon> Refresh
          </button>
          <a mat-button routerLink="/">Back to Trenchwork</a>
        </div>
      </header>
      <p class="note">Development build: nothing here is sent to a real mailbox.</p>
      <tw-state-panel
        [resource]="mail"
        loadingLabel="Reading the mailbox…"
        [empty]="messages().length === 0"
        emptyMessage="No mail captured yet."
        (retry)="mail.reload()"
      />
      <mat-accordion multi>
        @for (m of messages(); track $index) {
          <mat-expansion-panel [expanded]="$first">
            <mat-expansion-panel-header>
              <mat-panel-title>{{ m.subject }}</mat-panel-title>
              <mat-panel-description>{{ m.to }} · {{ m.date | date: 'medium' }}</mat-panel-description>
            </mat-expansion-panel-header>
            <pre class="body">@for (part of m.parts; track $index) {@if (part.href) {<a [href]="part.href">{{ part.text }}</a>} @else {{{ part.text }}}}</pre>
          </mat-expansion-panel>
        }
      </mat-accordion>
    </div>
  `,
  styles: `
    .note {
      margin: 0 0 16px;
      color: var(--mat-sys-on-surface-variant);
    }
    .body {
      white-space: pre-wrap;
      overflow-wrap: anywhere;
      font: var(--mat-sys-body-medium);
      margin: 0;
    }
  `,
})
export class MailboxPage {
  protected readonly mail = httpResource<DevMailResponse>(() => ({ url: '/api/dev/mail', context: inlineErrors() }));
  protected readonly messages = computed(() =>
    this.mail.hasValue() ? this.mail.value().messages.map((m) => ({ ...m, parts: linkify(m.text) })) : [],
  );
}
