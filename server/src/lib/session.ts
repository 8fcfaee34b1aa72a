import connectPgSimple from 'connect-pg-simple';
import session, { type SessionData } from 'express-session';
import type { Request, RequestHandler } from 'express';
import { randomBytes, timingSafeEqual } from 'node:crypto';
import type pg from 'pg';
import type { Config } from '../config';
import { API_VERSION, API_VERSION_HEADER, DEVICE_HEADER, DEVICE_LABEL_PATTERN } from '@contract';
import { ApiVersionError, BadRequestError, CsrfError, OtherPersonError } from './errors';

/** The signed-in person as read with the session (one statement); loadActor turns it into `req.actor`. */
export interface SessionUser {
  readonly id: string;
  readonly companyId: string;
  readonly role: string;
  readonly name: string;
  readonly email: string;
  readonly active: boolean;
}

const USER = Symbol('sessionUser');
const STORED_EXPIRY = Symbol('storedExpiry');
type LoadedSession = SessionData & { [USER]?: SessionUser | null; [STORED_EXPIRY]?: number };

/** How often a used session's idle expiry (the row's `expire`) is pushed forward. */
export const SESSION_REFRESH_MS = 60_000;

const PgStore = connectPgSimple(session);

/**
 * connect-pg-simple with two changes:
 * - the read of a session is joined to its user: one indexed statement (session.sid and app_user.id
 *   are primary keys) instead of a session read plus a user read. The user is read on every request,
 *   never cached, so a deactivation or a role change counts at once;
 * - the idle expiry is written at most once a minute (express-session touches on every request):
 *   a touch writes only when the new expiry is a minute or more past the stored one. A session
 *   therefore ends between idle − 1 min and idle after its last request, never later. The cookie
 *   is still sent with every answer (rolling), so the browser never drops it first.
 */
class SessionWithUserStore extends PgStore {
  constructor(private readonly db: pg.Pool) {
    super({ pool: db, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 });
  }

  override get(sid: string, callback: (err: unknown, session?: SessionData | null) => void): void {
    this.db
      .query<{
        sess: SessionData;
        expire_epoch: string;
        user_id: string | null;
        company_id: string;
        role: string;
        name: string;
        email: string;
        active: boolean;
      }>(
        `select s.sess, extract(epoch from s.expire::timestamptz) as expire_epoch,
           u.id as user_id, u.company_id, u.role, u.name, u.email, u.active
         from "session" s left join "app_user" u on u.id = case
           when s.sess->>'userId' ~ '^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$'
           then (s.sess->>'userId')::uuid end
         where s.sid = $1 and s.expire >= to_timestamp($2)`,
        [sid, Math.ceil(Date.now() / 1000)],
      )
      .then(({ rows }) => {
        const row = rows[0];
        if (!row) return callback(null, null);
        const sess: LoadedSession = row.sess;
        const user: SessionUser | null = row.user_id
          ? {
              id: row.user_id,
              companyId: row.company_id,
              role: row.role,
              name: row.name,
              email: row.email,
              active: row.active,
            }
          : null;
        Object.defineProperty(sess, USER, { enumerable: false, value: user });
        Object.defineProperty(sess, STORED_EXPIRY, { enumerable: false, value: Number(row.expire_epoch) });
        callback(null, sess);
      }, callback);
  }

  // express-session turns the stored data into req.session here: the user read with it goes on the
  // request, the stored expiry on the session (not enumerable, so never saved).
  override createSession(req: Request, data: SessionData): session.Session & SessionData {
    const loaded = data as LoadedSession;
    req.sessionUser = loaded[USER] ?? null;
    const created = super.createSession(req, data);
    Object.defineProperty(created, STORED_EXPIRY, { enumerable: false, value: loaded[STORED_EXPIRY] });
    return created;
  }

  override touch(sid: string, sess: SessionData, callback?: (err?: unknown) => void): void {
    const stored = (sess as LoadedSession)[STORED_EXPIRY];
    const next = sess.cookie?.expires ? new Date(sess.cookie.expires).getTime() / 1000 : Number.POSITIVE_INFINITY;
    if (stored !== undefined && Number.isFinite(stored) && next - stored < SESSION_REFRESH_MS / 1000) {
      callback?.();
      return;
    }
    super.touch(sid, sess, callback as () => void);
  }
}

/**
 * Sessions live in PostgreSQL (table `session`, created by a migration), so any server process can
 * serve any request. See SessionWithUserStore for how the idle expiry is kept.
 */
export function sessionMiddleware(config: Config, pool: pg.Pool): RequestHandler {
  const secure = config.NODE_ENV === 'production' || config.APP_ORIGIN.startsWith('https:');
  return session({
    name: secure ? '__Host-sid' : 'sid',
    secret: config.SESSION_SECRET,
    store: new SessionWithUserStore(pool),
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

/**
 * The device a write comes from (an opaque label the browser made, contract/device.ts) goes onto the actor,
 * so the record it changes keeps it. A malformed label is refused before anything changes.
 */
export const deviceGuard: RequestHandler = (req, _res, next) => {
  const device = req.get(DEVICE_HEADER);
  if (device === undefined) return next();
  if (!DEVICE_LABEL_PATTERN.test(device))
    return next(new BadRequestError(`${DEVICE_HEADER} must be 8 to 40 letters, digits or hyphens.`));
  if (req.actor) req.actor.device = device;
  next();
};

/**
 * Every /api answer names the API version; a write from a client built against another one is
 * refused before it touches anything (reads go through: the client shows its own message).
 */
export const apiVersionGuard: RequestHandler = (req, res, next) => {
  res.setHeader(API_VERSION_HEADER, String(API_VERSION));
  const sent = req.get(API_VERSION_HEADER);
  if (sent === undefined || SAFE.has(req.method) || sent === String(API_VERSION)) return next();
  next(new ApiVersionError(sent, API_VERSION));
};
