import { z } from 'zod';
import { newPassword, ROLES, type Role } from './auth';

/** A team member as the team-administration API shows it. */
export interface MemberDto {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  createdAt: string;
}

/** A pending invitation to join the team. */
export interface InvitationDto {
  id: number;
  email: string;
  role: Role;
  invitedBy: string | null;
  expiresAt: string;
  createdAt: string;
}

/** What an invitation link shows before it is accepted. */
export interface InvitationPreviewDto {
  email: string;
  role: Role;
  teamName: string;
  expiresAt: string;
}

/** A message caught by the local SMTP catcher (dev mailbox). */
export interface CapturedMailDto {
  id: number;
  sender: string;
  recipients: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
  /** Every http(s) link found in the text part, in order. */
  links: string[];
}

const email = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .min(1, 'Enter an e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter an e-mail address like name@example.com.' }))
  .transform((value) => value.toLowerCase());

const role = z.enum(ROLES, { error: `Role must be one of: ${ROLES.join(', ')}.` });

/** POST /api/team/invitations */
export const inviteBody = z.object({ email, role });
export type InviteBody = z.infer<typeof inviteBody>;

/** PATCH /api/team/members/:id: change the role, deactivate or reactivate. */
export const memberPatchBody = z
  .object({
    role: role.optional(),
    active: z.boolean({ error: 'Active must be true or false.' }).optional(),
  })
  .refine((b) => b.role !== undefined || b.active !== undefined, { message: 'Send a role or an active flag to change.', path: ['role'] });
export type MemberPatchBody = z.infer<typeof memberPatchBody>;

const token = z.string({ error: 'The link has no token.' }).trim().regex(/^[A-Za-z0-9_-]{20,100}$/, 'The link is not valid; open it again from the e-mail.');

/** POST /api/access/invitations/accept */
export const acceptInviteBody = z.object({
  token,
  name: z.string({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(120, 'Keep the name under 120 characters.'),
  password: newPassword,
});
export type AcceptInviteBody = z.infer<typeof acceptInviteBody>;

/** POST /api/access/password-reset */
export const resetRequestBody = z.object({ email });
export type ResetRequestBody = z.infer<typeof resetRequestBody>;

/** POST /api/access/password-reset/complete */
export const resetCompleteBody = z.object({ token, password: newPassword });
export type ResetCompleteBody = z.infer<typeof resetCompleteBody>;

/** The one answer to a reset request, whether or not the address belongs to anyone. */
export const RESET_REQUESTED_MESSAGE =
  'If that address belongs to an active Slantwise account, a reset link is on its way. It works once, within an hour.';
