import type { Actor } from '../lib/route';

declare global {
  namespace Express {
    interface Request {
      actor?: Actor;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    userId?: string;
    /** Epoch ms of sign-in, for the absolute lifetime (express-session only knows idle expiry). */
    authAt?: number;
    csrf?: string;
  }
}

export {};
