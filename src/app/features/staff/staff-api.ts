import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Invitation, InvitationCreate, Member } from '@shared/api/team';
import type { Role } from '@shared/roles';
import { inlineErrors } from '../../core/http/inline-errors';

/** Staff and invitation writes (admin only). Failures not marked inline surface as a snackbar. */
@Injectable({ providedIn: 'root' })
export class StaffApi {
  private readonly http = inject(HttpClient);

  updateMember(teamId: number, membershipId: number, change: { role?: Role; active?: boolean }): Observable<Member> {
    return this.http.patch<Member>(`/api/teams/${teamId}/members/${membershipId}`, change);
  }

  invite(teamId: number, invitation: InvitationCreate): Observable<Invitation> {
    return this.http.post<Invitation>(`/api/teams/${teamId}/invitations`, invitation, { context: inlineErrors() });
  }

  resend(teamId: number, invitationId: number): Observable<Invitation> {
    return this.http.post<Invitation>(`/api/teams/${teamId}/invitations/${invitationId}/resend`, {});
  }

  revoke(teamId: number, invitationId: number): Observable<void> {
    return this.http.delete<void>(`/api/teams/${teamId}/invitations/${invitationId}`);
  }
}
