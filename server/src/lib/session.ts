import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { RequestHandler } from 'express';
import { randomBytes, timingSafeEqual } from 'node:crypto';
import type pg from 'pg';
import type { Config } from '../config';
import { CsrfError, OtherPersonError } from './errors';

/** Sessions live in PostgreSQL (table `session`, created by a migration), so any server process can serve any request. */
export function sessionMiddleware(config: Config, pool: pg.Pool): RequestHandler {
  const PgStore = connectPgSimple(session);
  const secure = config.NODE_ENV === 'production' || config.APP_ORIGIN.startsWith('https:');
  return session({
    name: secure ? '__Host-sid' : 'sid',
    secret: config.SESSION_SECRET,
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: 'auto',
      path: '/',
      maxAge: config.SESSION_IDLE_MINUTES * 60_000,
    },
  });
}

export function newCsrfToken(): string {
  return randomBytes(32).toString('base64url');
}

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Synchronizer token: every state-changing request carries the session's token in X-CSRF-Token. */
export const csrfGuard: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method)) return next();
  if (req.headers['sec-fetch-site'] === 'cross-site') return next(new CsrfError());
  const sent = req.get('x-csrf-token');
  const expected = req.session?.csrf;
  if (!sent || !expected) return next(new CsrfError());
  const a = Buffer.from(sent);
  const b = Buffer.from(expected);
  if (a.length !== b.length || !timingSafeEqual(a, b)) return next(new CsrfError());
  next();
};

/** The header the client's offline queue sends with each replayed change: the id of the person who made it. */
export const PERSON_HEADER = 'x-gaugeline-person';

/**
 * A change waiting on a shared device carries the id of the person who made it; sent under
 * anyone else's session it is refused (403 other-person) and stays on the device for its owner.
 * Without a session the route's own policy answers (401), so the person can sign in again.
 */
export const personGuard: RequestHandler = (req, _res, next) => {
  const person = req.get(PERSON_HEADER);
  if (person === undefined || !req.actor) return next();
  if (person !== req.actor.userId) return next(new OtherPersonError());
  next();
};
