import bcrypt from 'bcrypt';
import { Router } from 'express';
import { Op } from 'sequelize';
import type { InvitationPreviewDto } from '../../shared/api/team-admin';
import { acceptInviteBody, RESET_REQUESTED_MESSAGE, resetCompleteBody, resetRequestBody } from '../../shared/api/team-admin';
import { HttpError } from '../middleware/http-error';
import { parseBody } from '../middleware/validate';
import { Invitation, PasswordReset, Session, Team, User } from '../models';
import type { LoginThrottle } from '../services/login-throttle';
import { sendMail } from '../services/mailer';
import { resetMail } from '../services/team-mail';
import { hashToken, newToken, RESET_TTL_MS } from '../services/tokens';
import { BCRYPT_COST } from './auth';

const GONE = 'This link has expired or was already used. Ask for a new one.';
const WITHDRAWN = 'This invitation was withdrawn, or replaced by a newer one. Use the newest invitation e-mail, or ask the team\'s admin to invite you again.';
const UNKNOWN = 'This link is not valid. Open it again from the e-mail, or ask for a new one.';

function tokenParam(raw: string | string[] | undefined): string {
  const text = Array.isArray(raw) ? raw[0] : raw;
  if (!text || !/^[A-Za-z0-9_-]{20,100}$/.test(text)) throw new HttpError(404, UNKNOWN);
  return text;
}

/** Revoked by an admin or replaced by a newer invitation, never accepted. */
function withdrawn(invitation: Invitation): boolean {
  return invitation.revokedAt !== null && invitation.acceptedAt === null;
}

async function openInvitation(token: string): Promise<Invitation> {
  const invitation = await Invitation.findOne({ where: { tokenHash: hashToken(token) }, include: [{ model: Team, as: 'team' }] });
  if (!invitation) throw new HttpError(404, UNKNOWN);
  if (!invitation.isOpen()) throw new HttpError(410, withdrawn(invitation) ? WITHDRAWN : GONE);
  return invitation;
}

async function openReset(token: string): Promise<PasswordReset> {
  const reset = await PasswordReset.findOne({ where: { tokenHash: hashToken(token) } });
  if (!reset) throw new HttpError(404, UNKNOWN);
  if (!reset.isOpen()) throw new HttpError(410, GONE);
  return reset;
}

/** Makes a reset token for an active account and mails it; does nothing for an unknown address. */
async function issueReset(email: string): Promise<void> {
  const user = await User.findOne({ where: { email } });
  if (!user || !user.active) return;
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + RESET_TTL_MS);
  // Only the newest link works: a new request ends the open ones, as a new invitation does.
  await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null } });
  await PasswordReset.create({ userId: user.id, tokenHash: hash, expiresAt });
  await sendMail(resetMail(user.email, user.name, token, expiresAt));
}

/**
 * /api/access: the public ends of the e-mailed links (invitation, password reset). Nothing here
 * tells whether an address has an account.
 */
export function createAccessRouter(resetThrottle: LoginThrottle): Router {
  const router = Router();

  router.get('/invitations/:token', async (req, res) => {
    const invitation = await openInvitation(tokenParam(req.params['token']));
    const preview: InvitationPreviewDto = {
      email: invitation.email,
      role: invitation.role,
      teamName: invitation.team?.name ?? '',
      expiresAt: invitation.expiresAt.toISOString(),
    };
    res.json(preview);
  });

  router.post('/invitations/accept', async (req, res) => {
    const body = parseBody(acceptInviteBody, req.body);
    const invitation = await openInvitation(body.token);
    if (await User.findOne({ where: { email: invitation.email } })) {
      throw new HttpError(409, 'That e-mail address already has a Slantwise account; sign in instead.');
    }
    const passwordHash = await bcrypt.hash(body.password, BCRYPT_COST);
    const sequelize = Invitation.sequelize!;
    const user = await sequelize.transaction(async (transaction) => {
      // Claim the invitation first: of two simultaneous uses, only one updates the row.
      const [claimed] = await Invitation.update(
        { acceptedAt: new Date() },
        { where: { id: invitation.id, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } }, transaction },
      );
      if (claimed === 0) {
        // Revoked between the look-up and the claim: say so, as the look-up would now.
        await invitation.reload({ transaction });
        throw new HttpError(410, withdrawn(invitation) ? WITHDRAWN : GONE);
      }
      return User.create({ teamId: invitation.teamId, email: invitation.email, name: body.name, role: invitation.role, passwordHash }, { transaction });
    });
    res.status(201).json({ user: user.toPublic() });
  });

  router.post('/password-reset', async (req, res) => {
    const { email } = parseBody(resetRequestBody, req.body);
    const keys = [`reset-account:${email}`, `reset-ip:${req.ip ?? 'unknown'}`];
    const wait = await resetThrottle.retryAfter(keys);
    if (wait > 0) {
      res.set('Retry-After', String(wait));
      throw new HttpError(429, `Too many reset requests. Try again in ${Math.ceil(wait / 60)} minute(s).`);
    }
    await resetThrottle.recordFailure(keys);
    // Answer before looking the address up, so the reply and its timing are the same for every address.
    void issueReset(email).catch((err: unknown) => console.error('[access] password reset failed:', err));
    res.status(202).json({ message: RESET_REQUESTED_MESSAGE });
  });

  router.get('/password-reset/:token', async (req, res) => {
    const reset = await openReset(tokenParam(req.params['token']));
    res.json({ valid: true, expiresAt: reset.expiresAt.toISOString() });
  });

  router.post('/password-reset/complete', async (req, res) => {
    const body = parseBody(resetCompleteBody, req.body);
    const reset = await openReset(body.token);
    const passwordHash = await bcrypt.hash(body.password, BCRYPT_COST);
    await PasswordReset.sequelize!.transaction(async (transaction) => {
      const [claimed] = await PasswordReset.update(
        { usedAt: new Date() },
        { where: { id: reset.id, usedAt: null, expiresAt: { [Op.gt]: new Date() } }, transaction },
      );
      if (claimed === 0) throw new HttpError(410, GONE);
      const [updated] = await User.update({ passwordHash }, { where: { id: reset.userId, active: true }, transaction });
      if (updated === 0) throw new HttpError(410, GONE);
      // Every other open link of the account dies with this one, and every session ends.
      await PasswordReset.update({ usedAt: new Date() }, { where: { userId: reset.userId, usedAt: null }, transaction });
      await Session.destroy({ where: { userId: reset.userId }, transaction });
    });
    res.status(204).end();
  });

  return router;
}
