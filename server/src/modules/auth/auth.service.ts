import type { Request } from 'express';
import { UnauthenticatedError } from '../../lib/errors';
import type { Actor } from '../../lib/route';
import type { ServiceContext } from '../../lib/service-context';
import { newCsrfToken } from '../../lib/session';
import { dummyHash, hashPassword, needsRehash, verifyPassword } from '../../services/passwords';
import { UserSchema, type User } from '../users/user.entity';
import type { LoginLimiter } from './rate-limit';

export const LOGIN_FAILED = 'The e-mail or password is not right.';

function regenerate(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
}

function save(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

/** Sign-in works on the request's session (no one is signed in yet) and counts failures. */
export interface SignInContext extends ServiceContext<Actor | null> {
  readonly req: Request;
  readonly limiter: LoginLimiter;
}

/** Checks the password; on success starts a fresh session (new id, new CSRF token) for the user. */
export async function signIn(
  { em, clock, req, limiter }: SignInContext,
  input: { email: string; password: string },
): Promise<User> {
  const ip = req.ip ?? 'unknown';
  await limiter.assertAllowed(input.email, ip);
  const user = await em.findOne(UserSchema, { email: input.email }, { populate: ['company', 'passwordHash'] });
  const ok = await verifyPassword(user?.passwordHash ?? (await dummyHash()), input.password);
  if (!user || !ok || !user.active) {
    await limiter.recordFailure(input.email, ip);
    req.log?.info({ event: 'login_failed' }, 'sign-in failed');
    throw new UnauthenticatedError(LOGIN_FAILED);
  }
  await limiter.recordSuccess(input.email);
  if (needsRehash(user.passwordHash)) {
    user.passwordHash = await hashPassword(input.password);
    await em.flush();
  }
  await regenerate(req);
  req.session.userId = user.id;
  req.session.authAt = clock.now().getTime();
  req.session.csrf = newCsrfToken();
  await save(req);
  req.log?.info({ event: 'login_ok', userId: user.id }, 'signed in');
  return user;
}

export function signOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    if (!req.session) return resolve();
    req.session.destroy((err) => (err ? reject(err) : resolve()));
  });
}

/** The CSRF token of this session; creates the (anonymous) session on first call. */
export async function csrfToken(req: Request): Promise<string> {
  if (!req.session.csrf) {
    req.session.csrf = newCsrfToken();
    await save(req);
  }
  return req.session.csrf;
}
