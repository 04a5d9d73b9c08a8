import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import '../session-types';
import { HttpError } from './http-error';

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The session's CSRF token, made on first use (which stores the session: its expiry starts now). */
export function csrfToken(req: Request): string {
  if (req.session.csrfToken === undefined) {
    req.session.csrfToken = randomBytes(32).toString('base64url');
    req.session.renewedAt = Date.now();
  }
  return req.session.csrfToken;
}

function same(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/**
 * Every unsafe request under /api must carry the session's token in `X-CSRF-Token`, except the
 * stateless calculation routes (they store nothing and need no session).
 */
export function requireCsrf(exemptPrefixes: readonly string[]): RequestHandler {
  return (req, _res, next) => {
    if (!UNSAFE.has(req.method) || exemptPrefixes.some((p) => req.path.startsWith(p))) return next();
    const sent = req.get('x-csrf-token');
    const expected = req.session?.csrfToken;
    if (!sent || !expected || !same(sent, expected)) {
      throw new HttpError(403, 'Missing or invalid CSRF token: fetch GET /api/auth/csrf and send it as the X-CSRF-Token header.');
    }
    next();
  };
}
