import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role } from '../../shared/api/auth';
import '../session-types';
import { User } from '../models/user';
import type { SessionStore } from '../services/session-store';
import { HttpError } from './http-error';

/**
 * Loads the session's user on every request, so a deactivated member or a changed role takes
 * effect at once. A session whose user is gone or inactive is destroyed. The session store
 * usually read the user already, in the same query as the session (`takeUser`).
 */
export function loadUser(sessions: Pick<SessionStore, 'takeUser'>): RequestHandler {
  return async (req, _res, next) => {
    const id = req.session?.userId;
    if (!id) return next();
    const handed = sessions.takeUser(req.sessionID);
    const user = handed && handed.id === id ? handed : await User.findByPk(id);
    if (user && user.active) {
      req.user = user;
      return next();
    }
    req.session.destroy(() => next());
  };
}

/**
 * Renews a stored session's idle expiry at most once per `everyMs`: the session is marked changed,
 * so express-session writes it (with a new `expires`) and sends the cookie again with a new expiry.
 * Between renewals a response carries no Set-Cookie, and nothing is written. A session that was
 * never stored (no sign-in, no CSRF token) is left alone, so no row is made for it.
 */
export function renewSessions(everyMs: number): RequestHandler {
  return (req, _res, next) => {
    const session = req.session;
    if (session && (session.userId !== undefined || session.csrfToken !== undefined)) {
      const now = Date.now();
      if (session.renewedAt === undefined || now - session.renewedAt >= everyMs) session.renewedAt = now;
    }
    next();
  };
}

/** The signed-in user, or a 401. */
export function currentUser(req: Request): User {
  if (!req.user) throw new HttpError(401, 'Sign in to do this.');
  return req.user;
}

export const requireUser: RequestHandler = (req: Request, _res: Response, next: NextFunction) => {
  currentUser(req);
  next();
};

/** Allows only the given roles (after sign-in). */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    const user = currentUser(req);
    if (!roles.includes(user.role)) throw new HttpError(403, `Only ${roles.join(' or ')} members may do this.`);
    next();
  };
}
