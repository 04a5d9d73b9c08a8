/**
 * Reads the local SMTP catcher's captured_mails table from tests: messages arrive a moment after
 * the API answers, so lookups poll for a while.
 */
import { Op } from 'sequelize';
import { CapturedMail } from '../../server/models';

/** Waits for the newest message to `to` whose subject contains `subject`; fails after `timeoutMs`. */
export async function waitForMail(to: string, subject: string, timeoutMs = 8000): Promise<CapturedMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const mail = await CapturedMail.findOne({
      where: { recipients: { [Op.like]: `%${to}%` }, subject: { [Op.like]: `%${subject}%` } },
      order: [['id', 'DESC']],
    });
    if (mail) return mail;
    if (Date.now() > until) throw new Error(`No mail to ${to} with subject "${subject}" within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Messages to `to` so far. */
export function mailsTo(to: string): Promise<CapturedMail[]> {
  return CapturedMail.findAll({ where: { recipients: { [Op.like]: `%${to}%` } }, order: [['id', 'ASC']] });
}

/** The token of the first app link with `?token=` in a message's text part. */
export function tokenIn(text: string, path: string): string {
  const match = new RegExp(`${path.replace(/[/?]/g, (c) => '\\' + c)}\\?token=([A-Za-z0-9_-]+)`).exec(text);
  if (!match) throw new Error(`No ${path}?token= link in:\n${text}`);
  return match[1]!;
}
