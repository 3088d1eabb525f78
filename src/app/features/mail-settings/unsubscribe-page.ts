import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { readApiError } from '../../core/http/api-error';
import { AccountFrame } from '../account/account-frame';
import { MailApi } from './mail-api';
import { MAIL_LIST_DESCRIPTIONS, MAIL_LIST_NAMES, MailList, listOfToken } from './mail-lists';

type State = { kind: 'ready' } | { kind: 'sending' } | { kind: 'done'; list: MailList } | { kind: 'failed'; message: string; retry: boolean };

/**
 * Opened from the link at the bottom of a mail: /mail/unsubscribe?token=… No sign-in needed.
 * Opening the page changes nothing (mail scanners open links too); only the button does.
 */
@Component({
  selector: 'tw-unsubscribe-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [AccountFrame, MatButtonModule, MatIconModule, RouterLink],
  template: `
    <tw-account-frame heading="Stop a mail">
      @if (!token()) {
        <div class="tw-alert tw-alert-attention" role="alert">
          <mat-icon aria-hidden="true">link_off</mat-icon>
          <p>This link is incomplete. Open it again from the mail, or change your mails in Mail settings after signing in.</p>
        </div>
      } @else {
        @switch (state().kind) {
          @case ('done') {
            <div class="tw-alert tw-alert-info" role="status">
              <mat-icon aria-hidden="true">check_circle</mat-icon>
              <p>Done. You will not get “{{ doneName() }}” mails any more.</p>
            </div>
            <p class="aside">Changed your mind? Turn it back on in <a routerLink="/settings/mail">Mail settings</a> (sign-in needed).</p>
          }
          @default {
            <p class="explain">
              @if (list(); as l) {
                This stops <strong>“{{ names[l] }}”</strong>, {{ descriptions[l] }}, for the account the mail was sent to.
              } @else {
                This stops the kind of mail this link came in, for the account it was sent to.
              }
              Other mails stay as they are. Invitations and password resets always come.
            </p>
            @if (failure(); as f) {
              <div class="tw-alert tw-alert-error" role="alert">
                <mat-icon aria-hidden="true">error_outline</mat-icon>
                <p>{{ f.message }}</p>
              </div>
            }
            @if (canSend()) {
              <button mat-flat-button type="button" class="submit" [disabled]="state().kind === 'sending'" (click)="confirm()">
                {{ state().kind === 'sending' ? 'Stopping…' : list() ? 'Stop “' + names[list()!] + '” mails' : 'Stop these mails' }}
              </button>
            }
          }
        }
      }
    </tw-account-frame>
  `,
  styles: `
    .explain {
      font: var(--mat-sys-body-large);
      margin: 0 0 16px;
    }
    .submit {
      width: 100%;
      min-height: 48px;
    }
    .aside {
      font: var(--mat-sys-body-medium);
    }
  `,
})
export class UnsubscribePage {
  readonly token = input<string>();

  private readonly api = inject(MailApi);

  protected readonly names = MAIL_LIST_NAMES;
  protected readonly descriptions = MAIL_LIST_DESCRIPTIONS;
  protected readonly state = signal<State>({ kind: 'ready' });
  protected readonly list = computed(() => listOfToken(this.token()));
  protected readonly failure = computed(() => {
    const s = this.state();
    return s.kind === 'failed' ? s : null;
  });
  protected readonly canSend = computed(() => {
    const s = this.state();
    return s.kind !== 'failed' || s.retry;
  });
  protected readonly doneName = computed(() => {
    const s = this.state();
    return s.kind === 'done' ? MAIL_LIST_NAMES[s.list] : '';
  });

  protected confirm(): void {
    const token = this.token();
    if (!token || this.state().kind === 'sending') return;
    this.state.set({ kind: 'sending' });
    this.api.unsubscribe(token).subscribe({
      next: (answer) => this.state.set({ kind: 'done', list: answer.list }),
      error: (failure: unknown) => {
        const error = readApiError(failure);
        // A bad link stays bad; a network hiccup may be tried again.
        this.state.set({ kind: 'failed', message: error.message, retry: error.status === 0 || error.status >= 500 });
      },
    });
  }
}
