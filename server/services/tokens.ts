import { createHash, randomBytes } from 'node:crypto';

/** A fresh single-use token for a link, and the sha256 that is all the database keeps of it. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

/** sha256 of a token, hex: what is stored and looked up. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** How long an invitation link works. */
export const INVITATION_TTL_MS = 7 * 24 * 60 * 60_000;
/** How long a password-reset link works. */
export const RESET_TTL_MS = 60 * 60_000;
