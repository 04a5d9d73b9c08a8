import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { Role } from '../../../shared/api/auth';
import type { CapturedMailDto, InvitationDto, InvitationPreviewDto, MemberDto } from '../../../shared/api/team-admin';
import { quietErrors } from '../core/api-error';

/** Team administration, the dev mailbox, and the public ends of the e-mailed links. */
@Injectable({ providedIn: 'root' })
export class TeamApi {
  private readonly http = inject(HttpClient);

  /** The team's members (admins and leads). */
  members(): Observable<MemberDto[]> {
    return this.http.get<{ members: MemberDto[] }>('/api/team/members').pipe(map((r) => r.members));
  }

  /** Changes a member's role or active flag (admins). */
  updateMember(id: number, change: { role?: Role; active?: boolean }): Observable<MemberDto> {
    return this.http.patch<MemberDto>(`/api/team/members/${id}`, change);
  }

  /** Open invitations (admins). */
  invitations(): Observable<InvitationDto[]> {
    return this.http.get<{ invitations: InvitationDto[] }>('/api/team/invitations').pipe(map((r) => r.invitations));
  }

  /** Invites someone by e-mail (admins); field errors come back as a 400 for the form. */
  invite(email: string, role: Role): Observable<{ invitation: InvitationDto; mailSent: boolean }> {
    return this.http.post<{ invitation: InvitationDto; mailSent: boolean }>('/api/team/invitations', { email, role }, { context: quietErrors() });
  }

  /** Revokes an open invitation (admins). */
  revoke(id: number): Observable<void> {
    return this.http.delete<void>(`/api/team/invitations/${id}`);
  }

  /** Messages caught by the local SMTP catcher (admins, only while it is in use). */
  mailbox(): Observable<CapturedMailDto[]> {
    return this.http.get<{ messages: CapturedMailDto[] }>('/api/team/mailbox', { context: quietErrors() }).pipe(map((r) => r.messages));
  }

  /** What an invitation link offers. */
  previewInvitation(token: string): Observable<InvitationPreviewDto> {
    return this.http.get<InvitationPreviewDto>(`/api/access/invitations/${encodeURIComponent(token)}`, { context: quietErrors() });
  }

  /** Accepts an invitation with a name and password. */
  acceptInvitation(token: string, name: string, password: string): Observable<unknown> {
    return this.http.post('/api/access/invitations/accept', { token, name, password }, { context: quietErrors() });
  }

  /** Asks for a password-reset link; the answer never tells whether the address has an account. */
  requestReset(email: string): Observable<{ message: string }> {
    return this.http.post<{ message: string }>('/api/access/password-reset', { email }, { context: quietErrors() });
  }

  /** Whether a reset link still works. */
  checkReset(token: string): Observable<unknown> {
    return this.http.get(`/api/access/password-reset/${encodeURIComponent(token)}`, { context: quietErrors() });
  }

  /** Sets a new password with a reset link. */
  completeReset(token: string, password: string): Observable<unknown> {
    return this.http.post('/api/access/password-reset/complete', { token, password }, { context: quietErrors() });
  }
}
