import { Router } from 'express';
import { Op } from 'sequelize';
import type { CapturedMailDto, MemberDto } from '../../shared/api/team-admin';
import { inviteBody, memberPatchBody } from '../../shared/api/team-admin';
import type { AppConfig } from '../config';
import { currentUser, requireRole } from '../middleware/auth';
import { HttpError } from '../middleware/http-error';
import { parseBody, parseId } from '../middleware/validate';
import { CapturedMail, Invitation, Session, User } from '../models';
import { sendMail } from '../services/mailer';
import { invitationMail, teamName } from '../services/team-mail';
import { INVITATION_TTL_MS, newToken } from '../services/tokens';

function memberDto(user: User): MemberDto {
  return { id: user.id, email: user.email, name: user.name, role: user.role, active: user.active, createdAt: user.createdAt.toISOString() };
}

const LINK = /https?:\/\/[^\s<>"')]+/g;

/** The captured message as the dev mailbox shows it, with the links of its text part. */
export function capturedMailDto(mail: CapturedMail): CapturedMailDto {
  return {
    id: mail.id,
    sender: mail.sender,
    recipients: mail.recipients,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    receivedAt: mail.receivedAt.toISOString(),
    links: [...new Set(mail.text.match(LINK) ?? [])],
  };
}

/** /api/team: members, roles, invitations (admins; leads may list members) and the dev mailbox. */
export function createTeamAdminRouter(config: AppConfig): Router {
  const router = Router();
  const adminOnly = requireRole('admin');

  router.get('/members', requireRole('admin', 'lead'), async (req, res) => {
    const user = currentUser(req);
    const members = await User.findAll({ where: { teamId: user.teamId }, order: [['active', 'DESC'], ['name', 'ASC'], ['id', 'ASC']] });
    res.json({ members: members.map(memberDto) });
  });

  router.patch('/members/:id', adminOnly, async (req, res) => {
    const admin = currentUser(req);
    const id = parseId(req.params['id'], 'member');
    const member = await User.findOne({ where: { id, teamId: admin.teamId } });
    if (!member) throw new HttpError(404, 'No member with that id in your team.');
    const body = parseBody(memberPatchBody, req.body);
    if (member.id === admin.id) {
      // An admin who demotes or deactivates themselves could leave the team without an admin.
      throw new HttpError(409, 'You cannot change your own role or deactivate yourself; ask another admin.');
    }
    if (body.role !== undefined) member.role = body.role;
    if (body.active !== undefined) member.active = body.active;
    await member.save();
    // Deactivation ends every session of the member at once; so does a role change (fresh sign-in, fresh rights).
    if (body.active === false || body.role !== undefined) await Session.destroy({ where: { userId: member.id } });
    res.json(memberDto(member));
  });

  router.get('/invitations', adminOnly, async (req, res) => {
    const admin = currentUser(req);
    const rows = await Invitation.findAll({
      where: { teamId: admin.teamId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
      include: [{ model: User, as: 'invitedBy', attributes: ['id', 'name'] }],
      order: [['createdAt', 'DESC'], ['id', 'DESC']],
    });
    res.json({ invitations: rows.map((i) => i.toDto()) });
  });

  router.post('/invitations', adminOnly, async (req, res) => {
    const admin = currentUser(req);
    const { email, role } = parseBody(inviteBody, req.body);
    if (await User.findOne({ where: { email } })) {
      throw new HttpError(409, 'That e-mail address already has a Slantwise account.', { email: 'already has an account' });
    }
    // A new invitation replaces any open one to the same address, so only the latest link works.
    await Invitation.update({ revokedAt: new Date() }, { where: { teamId: admin.teamId, email, acceptedAt: null, revokedAt: null } });
    const { token, hash } = newToken();
    const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
    const invitation = await Invitation.create({ teamId: admin.teamId, invitedById: admin.id, email, role, tokenHash: hash, expiresAt });
    invitation.invitedBy = admin;
    const mailSent = await sendMail(invitationMail(email, await teamName(admin.teamId), role, admin.name, token, expiresAt));
    res.status(201).json({ invitation: invitation.toDto(), mailSent });
  });

  router.delete('/invitations/:id', adminOnly, async (req, res) => {
    const admin = currentUser(req);
    const id = parseId(req.params['id'], 'invitation');
    const [count] = await Invitation.update({ revokedAt: new Date() }, { where: { id, teamId: admin.teamId, acceptedAt: null, revokedAt: null } });
    if (count === 0) throw new HttpError(404, 'No open invitation with that id in your team.');
    res.status(204).end();
  });

  // The dev mailbox exists only while the local SMTP catcher is in use.
  router.use('/mailbox', (_req, _res, next) => {
    if (!config.mailFake) throw new HttpError(404, 'The dev mailbox is off: mail goes to a real SMTP server (MAIL_FAKE=false).');
    next();
  }, adminOnly);

  router.get('/mailbox', async (req, res) => {
    const to = typeof req.query['to'] === 'string' ? req.query['to'].trim().toLowerCase() : '';
    const rows = await CapturedMail.findAll({
      where: to ? { recipients: { [Op.like]: `%${to.replace(/[\\%_]/g, (c) => '\\' + c)}%` } } : {},
      order: [['receivedAt', 'DESC'], ['id', 'DESC']],
      limit: 100,
    });
    res.json({ messages: rows.map(capturedMailDto) });
  });

  router.get('/mailbox/:id', async (req, res) => {
    const mail = await CapturedMail.findByPk(parseId(req.params['id'], 'message'));
    if (!mail) throw new HttpError(404, 'No captured message with that id.');
    res.json(capturedMailDto(mail));
  });

  return router;
}
