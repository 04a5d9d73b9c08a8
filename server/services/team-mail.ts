/**
 * The messages Slantwise sends: invitation, password reset, new assignment, set-up released.
 * Each has a plain-text part and a simple HTML part with the same words and link.
 */
import type { Role } from '../../shared/api/auth';
import { timeInZoneText } from '../../shared/training/time-zone';
import { Setup, Team, User } from '../models';
import { appLink, escapeHtml, sendMail, type OutgoingMail } from './mailer';

const ROLE_NAMES: Readonly<Record<Role, string>> = { admin: 'admin', lead: 'lead hand', machinist: 'machinist', apprentice: 'apprentice' };

interface Body {
  readonly greeting: string;
  readonly paragraphs: readonly string[];
  readonly link: { readonly label: string; readonly url: string };
  readonly footer?: string;
}

function compose(to: string, subject: string, body: Body): OutgoingMail {
  const text = [body.greeting, '', ...body.paragraphs.flatMap((p) => [p, '']), `${body.link.label}: ${body.link.url}`, '', body.footer ?? '', '— Slantwise']
    .join('\n')
    .replace(/\n{3,}/g, '\n\n');
  const html = [
    '<!doctype html><html><body style="font-family: sans-serif; line-height: 1.5; color: #1b1f24">',
    `<p>${escapeHtml(body.greeting)}</p>`,
    // A paragraph keeps its own line breaks (a lead's instructions).
    ...body.paragraphs.map((p) => `<p>${escapeHtml(p).replace(/\n/g, '<br>')}</p>`),
    `<p><a href="${escapeHtml(body.link.url)}">${escapeHtml(body.link.label)}</a></p>`,
    ...(body.footer ? [`<p style="font-size: 0.9em; color: #555">${escapeHtml(body.footer)}</p>`] : []),
    '<p>— Slantwise</p></body></html>',
  ].join('\n');
  return { to, subject, text, html };
}

/** The invitation to join a team, with its single-use link. */
export function invitationMail(to: string, team: string, role: Role, invitedBy: string, token: string, expiresAt: Date): OutgoingMail {
  return compose(to, `You are invited to join ${team} on Slantwise`, {
    greeting: 'Hello,',
    paragraphs: [
      `${invitedBy} invites you to join ${team} on Slantwise as ${ROLE_NAMES[role]}.`,
      `Open the link to choose your name and password. It works once, until ${expiresAt.toUTCString()}.`,
    ],
    link: { label: 'Accept the invitation', url: appLink(`/accept-invite?token=${token}`) },
    footer: 'If you did not expect this invitation, ignore this message; no account is made until the link is used.',
  });
}

/** The password-reset link. */
export function resetMail(to: string, name: string, token: string, expiresAt: Date): OutgoingMail {
  return compose(to, 'Reset your Slantwise password', {
    greeting: `Hello ${name},`,
    paragraphs: [
      'Someone (we hope you) asked to reset the password of your Slantwise account.',
      `Open the link to choose a new password. It works once, until ${expiresAt.toUTCString()}. Choosing a new password signs you out everywhere.`,
    ],
    link: { label: 'Choose a new password', url: appLink(`/reset-password?token=${token}`) },
    footer: 'If you did not ask for this, ignore this message: your password stays as it is.',
  });
}

/**
 * The notice of a new assignment to one apprentice, or (`dueMoved`) of its due date moved. The due
 * time is written on the clock of `timeZone` (the lead's browser's, checked on the server), with
 * the zone named: "Thu 3 Dec 2026, 23:00 (America/Chicago)".
 */
export function assignmentMail(
  to: string,
  name: string,
  title: string,
  problems: number,
  dueAt: Date,
  lead: string,
  assignmentId: number,
  instructions = '',
  options: { timeZone?: string; dueMoved?: boolean } = {},
): OutgoingMail {
  const due = timeInZoneText(dueAt, options.timeZone ?? 'UTC');
  if (options.dueMoved) {
    return compose(to, `New due date for training assignment: ${title}`, {
      greeting: `Hello ${name},`,
      paragraphs: [`${lead} has moved the due date of your training assignment "${title}".`, `It is now due ${due}.`],
      link: { label: 'Open the assignment', url: appLink(`/training/assignments/${assignmentId}`) },
    });
  }
  return compose(to, `New training assignment: ${title}`, {
    greeting: `Hello ${name},`,
    paragraphs: [
      `${lead} has given you a training assignment, "${title}", with ${problems} problem${problems === 1 ? '' : 's'} of your own.`,
      ...(instructions.trim() ? [`${lead}'s instructions:\n${instructions.trim()}`] : []),
      `It is due ${due}.`,
    ],
    link: { label: 'Open the assignment', url: appLink(`/training/assignments/${assignmentId}`) },
  });
}

/** The notice that a set-up was released, to its owner. */
export function setupReleasedMail(to: string, name: string, setupName: string, releasedBy: string | null, setupId: number): OutgoingMail {
  return compose(to, `Set-up released: ${setupName}`, {
    greeting: `Hello ${name},`,
    paragraphs: [
      `Your set-up "${setupName}" was released${releasedBy ? ` by ${releasedBy}` : ''}. The team now sees it in the set-up library.`,
      'Follow your shop rules for clamping and cutting when you run it.',
    ],
    link: { label: 'Open the set-up', url: appLink(`/library/${setupId}`) },
  });
}

/**
 * Tells a set-up's owner that it was released (called by the set-up release route). Sends nothing
 * when the owner released it themselves or is inactive. Resolves whether a message was accepted.
 */
export async function notifySetupReleased(setup: Setup, releasedBy?: User | null): Promise<boolean> {
  const owner = await User.findOne({ where: { id: setup.ownerId, teamId: setup.teamId } });
  if (!owner || !owner.active || owner.id === releasedBy?.id) return false;
  return sendMail(setupReleasedMail(owner.email, owner.name, setup.name, releasedBy?.name ?? null, setup.id));
}

/** The team's display name. */
export async function teamName(teamId: number): Promise<string> {
  return (await Team.findByPk(teamId))?.name ?? 'your team';
}
