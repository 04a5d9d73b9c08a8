import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTabsModule } from '@angular/material/tabs';
import { firstValueFrom } from 'rxjs';

import { ROLES, type Role } from '../../../shared/api/auth';
import type { CapturedMailDto, InvitationDto, MemberDto } from '../../../shared/api/team-admin';
import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { Auth, ROLE_LABELS } from '../core/auth';
import { TeamApi } from './team-api';
import { RouterLink } from '@angular/router';

/**
 * The team: members with their roles (admins change roles, deactivate and reactivate), invitations
 * by e-mail, and — while the local SMTP catcher is in use — the dev mailbox. Leads see the members.
 */
@Component({
  selector: 'sw-team-page',
  imports: [FormsModule, RouterLink, MatTabsModule, MatCardModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './team-page.html',
  styleUrl: './team-page.scss',
})
export default class TeamPage {
  private readonly api = inject(TeamApi);
  private readonly auth = inject(Auth);

  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly me = this.auth.user;
  protected readonly isAdmin = computed(() => this.auth.user()?.role === 'admin');
  protected readonly canSeeMembers = computed(() => ['admin', 'lead'].includes(this.auth.user()?.role ?? ''));
  protected readonly members = signal<MemberDto[]>([]);
  protected readonly invitations = signal<InvitationDto[]>([]);
  /** Captured messages, or null when the dev mailbox is off (real SMTP in use). */
  protected readonly mails = signal<CapturedMailDto[] | null>(null);
  protected readonly openMail = signal<number | null>(null);

  protected readonly inviteEmail = signal('');
  protected readonly inviteRole = signal<Role>('apprentice');
  protected readonly inviteErrors = signal<Record<string, string>>({});
  protected readonly inviteMessage = signal<string | null>(null);

  constructor() {
    void this.load();
  }

  /** What the last role change did, for the status line under the members. */
  protected readonly memberMessage = signal<string | null>(null);

  /**
   * Changes a member's role after asking (it takes effect on their next request, everywhere). When
   * the change is not made, the picker goes back to the role the member has.
   */
  protected async setRole(member: MemberDto, role: Role, picker?: { value: unknown }): Promise<void> {
    this.memberMessage.set(null);
    if (!confirm(`Change ${member.name}'s role from ${ROLE_LABELS[member.role]} to ${ROLE_LABELS[role]}? It takes effect at once, on every device they use.`)) {
      if (picker) picker.value = member.role;
      return;
    }
    try {
      const updated = await firstValueFrom(this.api.updateMember(member.id, { role }));
      this.members.update((list) => list.map((m) => (m.id === updated.id ? updated : m)));
      this.memberMessage.set(`${updated.name} is now ${ROLE_LABELS[updated.role]}.`);
    } catch (err) {
      if (picker) picker.value = member.role;
      this.memberMessage.set(apiErrorMessage(err));
    }
  }

  /** Deactivates (signing the member out everywhere at once) or reactivates a member. */
  protected async setActive(member: MemberDto, active: boolean): Promise<void> {
    if (!active && !confirm(`Deactivate ${member.name}? They are signed out everywhere at once and cannot sign in until reactivated.`)) return;
    const updated = await firstValueFrom(this.api.updateMember(member.id, { active }));
    this.members.update((list) => list.map((m) => (m.id === updated.id ? updated : m)));
  }

  /** Sends an invitation e-mail with a single-use link. */
  protected async invite(): Promise<void> {
    this.inviteErrors.set({});
    this.inviteMessage.set(null);
    try {
      const res = await firstValueFrom(this.api.invite(this.inviteEmail(), this.inviteRole()));
      this.inviteMessage.set(res.mailSent ? `Invitation sent to ${res.invitation.email}.` : `Invitation made for ${res.invitation.email}, but the mail server did not take the message; send it again later.`);
      this.inviteEmail.set('');
      await this.load();
    } catch (err) {
      this.inviteErrors.set(apiFieldErrors(err));
      this.inviteMessage.set(apiErrorMessage(err));
    }
  }

  /** Revokes an open invitation after asking: its link stops working at once. */
  protected async revoke(invitation: InvitationDto): Promise<void> {
    this.inviteMessage.set(null);
    if (!confirm(`Withdraw the invitation to ${invitation.email}? Its link stops working at once; you can invite the address again later.`)) return;
    try {
      await firstValueFrom(this.api.revoke(invitation.id));
      this.inviteMessage.set(`The invitation to ${invitation.email} is withdrawn.`);
    } catch (err) {
      this.inviteMessage.set(apiErrorMessage(err));
    }
    await this.load();
  }

  /** Reloads the captured messages. */
  protected async refreshMail(): Promise<void> {
    try {
      this.mails.set(await firstValueFrom(this.api.mailbox()));
    } catch {
      this.mails.set(null);
    }
  }

  protected toggleMail(id: number): void {
    this.openMail.update((open) => (open === id ? null : id));
  }

  private async load(): Promise<void> {
    await this.auth.ready();
    if (!this.canSeeMembers()) return;
    this.members.set(await firstValueFrom(this.api.members()));
    if (this.isAdmin()) {
      this.invitations.set(await firstValueFrom(this.api.invitations()));
      await this.refreshMail();
    }
  }
}
