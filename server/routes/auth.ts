import bcrypt from 'bcrypt';
import { Router, type Request } from 'express';
import { loginBody } from '../../shared/api/auth';
import { csrfToken } from '../middleware/csrf';
import { currentUser } from '../middleware/auth';
import { HttpError } from '../middleware/http-error';
import { parseBody } from '../middleware/validate';
import { User } from '../models/user';
import { Session } from '../models/session';
import type { LoginThrottle } from '../services/login-throttle';

/** bcrypt cost for every stored password. */
export const BCRYPT_COST = 12;

const BAD_LOGIN = 'E-mail or password is incorrect.';

// A real hash to compare against when the e-mail is unknown, so both failures take the same time.
const DUMMY_HASH = bcrypt.hashSync('no-such-user-password', BCRYPT_COST);

function regenerate(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
}

function save(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

export function createAuthRouter(throttle: LoginThrottle): Router {
  const router = Router();

  router.get('/csrf', (req, res) => {
    res.json({ token: csrfToken(req) });
  });

  router.post('/login', async (req, res) => {
    const { email, password } = parseBody(loginBody, req.body);
    const normalized = email.toLowerCase();
    const keys = [`account:${normalized}`, `ip:${req.ip ?? 'unknown'}`];
    const wait = await throttle.retryAfter(keys);
    if (wait > 0) {
      res.set('Retry-After', String(wait));
      throw new HttpError(429, `Too many failed sign-ins. Try again in ${Math.ceil(wait / 60)} minute(s).`);
    }
    const user = await User.findOne({ where: { email: normalized } });
    const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !ok || !user.active) {
      await throttle.recordFailure(keys);
      throw new HttpError(401, BAD_LOGIN);
    }
    await throttle.clear([keys[0]!]);
    // A new session id on sign-in (no fixation); the CSRF token carries over so the client's copy stays valid.
    const token = req.session.csrfToken;
    await regenerate(req);
    req.session.userId = user.id;
    if (token) req.session.csrfToken = token;
    req.session.renewedAt = Date.now();
    await save(req);
    await Session.update({ userId: user.id }, { where: { sid: req.sessionID } });
    res.json({ user: user.toPublic() });
  });

  router.post('/logout', async (req, res) => {
    await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
    res.status(204).end();
  });

  // For the app's start-up: who is signed in, without a 401 for an anonymous visit.
  router.get('/session', (req, res) => {
    res.json({ user: req.user ? req.user.toPublic() : null });
  });

  router.get('/me', (req, res) => {
    res.json(currentUser(req).toPublic());
  });

  return router;
}
