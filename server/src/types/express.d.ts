import type { Actor, LinkGrant } from '../lib/route';
import type { SessionUser } from '../lib/session';

declare global {
  namespace Express {
    interface Request {
      actor?: Actor;
      /** The session's user as read with the session (lib/session.ts); null when signed out. */
      sessionUser?: SessionUser | null;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    userId?: string;
    /** Epoch ms of sign-in, for the absolute lifetime (express-session only knows idle expiry). */
    authAt?: number;
    csrf?: string;
    /** A customer's proposal-link session (lib/route.ts `link` policy); staff sessions have none. */
    link?: LinkGrant;
  }
}

export {};
