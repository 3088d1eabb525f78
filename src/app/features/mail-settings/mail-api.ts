import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { MailPreferences } from '@shared/api/film-room';
import { inlineErrors } from '../../core/http/inline-errors';
import type { MailList } from './mail-lists';

export const MAIL_PREFERENCES_URL = '/api/me/mail-preferences';

@Injectable({ providedIn: 'root' })
export class MailApi {
  private readonly http = inject(HttpClient);

  save(preferences: MailPreferences): Observable<MailPreferences> {
    return this.http.put<MailPreferences>(MAIL_PREFERENCES_URL, preferences, { context: inlineErrors() });
  }

  /** Public: the token in the link is the whole authorisation. */
  unsubscribe(token: string): Observable<{ list: MailList }> {
    return this.http.post<{ list: MailList }>('/api/mail/unsubscribe', { token }, { context: inlineErrors() });
  }
}
