import type { User } from './models/user';

declare module 'express-session' {
  interface SessionData {
    userId: number;
    csrfToken: string;
    /** When the session's expiry was last renewed (ms since the epoch; see `renewSessions`). */
    renewedAt: number;
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** The signed-in, active user, set by `loadUser`. */
      user?: User;
    }
  }
}

export {};
