import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { PlayerListResponse } from '@shared/api/roster';
import type { Invitation, Member, StaffResponse } from '@shared/api/team';
import { ROLES, ROLE_LABELS, type Role } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { ConfirmDialog, ConfirmDialogData } from '../../core/feedback/confirm-dialog';
import { Notifier } from '../../core/feedback/notifier';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { InviteForm } from './invite-form';
import { StaffApi } from './staff-api';

/** Admin page: who is on the team with which role, and who is invited. */
@Component({
  selector: 'tw-staff-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, InviteForm, MatButtonModule, MatIconModule, MatSelectModule, MatTableModule, MatTooltipModule, StatePanel],
  templateUrl: './staff-page.html',
  styleUrl: './staff-page.scss',
})
export class StaffPage {
  private readonly auth = inject(AuthStore);
  private readonly api = inject(StaffApi);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);

  protected readonly roles = ROLES;
  // Widened for the tables' untyped row context.
  protected readonly roleLabels: Record<string, string> = ROLE_LABELS;
  protected readonly teamId = this.auth.teamId;
  protected readonly memberColumns = ['name', 'email', 'role', 'status', 'joined', 'actions'];
  protected readonly invitationColumns = ['email', 'role', 'entry', 'invitedBy', 'sent', 'expires', 'actions'];

  protected readonly staff = httpResource<StaffResponse>(() => {
    const teamId = this.teamId();
    return teamId === null ? undefined : { url: `/api/teams/${teamId}/staff`, context: inlineErrors() };
  });
  /** For naming the roster entry of player invitations and for the invite form. */
  protected readonly roster = httpResource<PlayerListResponse>(() => {
    const teamId = this.teamId();
    return teamId === null ? undefined : { url: `/api/teams/${teamId}/players`, context: inlineErrors() };
  });

  protected readonly players = computed(() => (this.roster.hasValue() ? this.roster.value().players : []));
  private readonly playerNames = computed(() => new Map(this.players().map((p) => [p.id, `#${p.jersey} ${p.name}`])));
  protected readonly members = computed(() => (this.staff.hasValue() ? this.staff.value().members : []));
  protected readonly invitations = computed(() => (this.staff.hasValue() ? this.staff.value().invitations : []));
  /** Role picks waiting for the server; shown in the select until it answers. */
  private readonly pendingRoles = signal<ReadonlyMap<number, Role>>(new Map());

  protected isSelf(member: Member): boolean {
    return member.userId === this.auth.user()?.id;
  }

  protected shownRole(member: Member): Role {
    return this.pendingRoles().get(member.membershipId) ?? member.role;
  }

  protected entryName(invitation: Invitation): string {
    if (invitation.playerId === null) return '';
    return this.playerNames().get(invitation.playerId) ?? `Entry ${invitation.playerId}`;
  }

  protected changeRole(member: Member, role: Role): void {
    const teamId = this.teamId();
    if (teamId === null || role === member.role) return;
    this.setPending(member.membershipId, role);
    this.api.updateMember(teamId, member.membershipId, { role }).subscribe({
      next: (saved) => {
        this.replaceMember(saved);
        this.setPending(member.membershipId, null);
        this.notifier.info(`${saved.name} is now ${ROLE_LABELS[saved.role]}.`);
      },
      // The interceptor shows why (e.g. the last admin); the select falls back to the saved role.
      error: () => this.setPending(member.membershipId, null),
    });
  }

  protected setActive(member: Member, active: boolean): void {
    const teamId = this.teamId();
    if (teamId === null) return;
    this.api.updateMember(teamId, member.membershipId, { active }).subscribe((saved) => {
      this.replaceMember(saved);
      this.notifier.info(active ? `${saved.name} can sign in to this team again.` : `${saved.name} no longer has access to this team.`);
    });
  }

  protected resend(invitation: Invitation): void {
    const teamId = this.teamId();
    if (teamId === null) return;
    this.api.resend(teamId, invitation.id).subscribe(() => {
      this.notifier.info(`Invitation sent again to ${invitation.email}.`);
      this.staff.reload();
    });
  }

  protected revoke(invitation: Invitation): void {
    const teamId = this.teamId();
    if (teamId === null) return;
    const data: ConfirmDialogData = {
      title: 'Revoke the invitation?',
      message: `The link sent to ${invitation.email} will stop working. You can invite the address again later.`,
      confirmLabel: 'Revoke',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .subscribe((confirmed) => {
        if (!confirmed) return;
        this.api.revoke(teamId, invitation.id).subscribe(() => {
          this.notifier.info(`Invitation for ${invitation.email} revoked.`);
          this.staff.reload();
        });
      });
  }

  protected onInvited(): void {
    this.staff.reload();
  }

  private setPending(membershipId: number, role: Role | null): void {
    this.pendingRoles.update((current) => {
      const next = new Map(current);
      if (role === null) next.delete(membershipId);
      else next.set(membershipId, role);
      return next;
    });
  }

  private replaceMember(saved: Member): void {
    if (!this.staff.hasValue()) return;
    const current = this.staff.value();
    this.staff.set({ ...current, members: current.members.map((m) => (m.membershipId === saved.membershipId ? saved : m)) });
  }
}
