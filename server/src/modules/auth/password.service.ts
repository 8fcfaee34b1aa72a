import { RESET_LINK_INVALID, RESET_LINK_MINUTES, RESET_PASSWORD_PATH } from '@contract';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Request } from 'express';
import { createHash, randomBytes } from 'node:crypto';
import { BadRequestError, ValidationError } from '../../lib/errors';
import type { Actor } from '../../lib/route';
import type { ServiceContext } from '../../lib/service-context';
import { hashPassword, verifyPassword } from '../../services/passwords';
import type { Queue } from '../../services/queue';
import type { Clock } from '../../services/services';
import { queueMessage } from '../mail/mail.service';
import type { OutgoingMessage } from '../mail/outgoing-message.entity';
import { UserSchema, type User } from '../users/user.entity';
import { endSessionsOf } from '../users/user.service';
import { PasswordResetTokenSchema } from './password-reset-token.entity';
import type { LoginLimiter } from './rate-limit';
import type { ResetLimiter } from './reset-limit';

export const CURRENT_PASSWORD_WRONG = 'The current password is not right.';

const sha256 = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');
const stamp = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

function queuePasswordChanged(em: EntityManager, queue: Queue, user: User, when: Date, how: string) {
  return queueMessage(em, queue, {
    companyId: user.company.id,
    userId: user.id,
    kind: 'password-changed',
    to: user.email,
    subject: 'Your Gaugeline password was changed',
    text:
      `Hello ${user.name},\n\nThe password of your Gaugeline account was changed ${how} on ${stamp(when)}. ` +
      `Every other device signed in to your account was signed out.\n\n` +
      `If this was not you, choose "Forgot password" on the sign-in page to set a new one, and tell your company's owner.\n`,
  });
}

/** Changing one's own password: the session it stays in, the sign-in limit and the queue for the notice. */
export interface PasswordChangeContext extends ServiceContext {
  readonly req: Request;
  readonly limiter: LoginLimiter;
  readonly queue: Queue;
}

/** Asking for a reset link (no one signed in): the request (its IP), the reset limit and the queue. */
export interface ResetRequestContext extends ServiceContext<Actor | null> {
  readonly req: Request;
  readonly limiter: ResetLimiter;
  readonly queue: Queue;
}

/** Using a reset link (no one signed in): the sign-in limit it lifts and the queue for the notice. */
export interface ResetContext extends ServiceContext<Actor | null> {
  readonly limiter: LoginLimiter;
  readonly queue: Queue;
}

/**
 * Changing one's own password: the current one is required (wrong tries count against the account's
 * sign-in limit), the user's other sessions and open reset links end, this one stays, and they are told by e-mail.
 */
export async function changePassword(
  { em, actor, clock, req, limiter, queue }: PasswordChangeContext,
  input: { currentPassword: string; newPassword: string },
): Promise<{ endedSessions: number }> {
  const ip = req.ip ?? 'unknown';
  await limiter.assertAllowed(actor.email, ip);
  const user = await em.findOneOrFail(UserSchema, { id: actor.userId }, { populate: ['company', 'passwordHash'] });
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    await limiter.recordFailure(actor.email, ip);
    throw new ValidationError([{ path: 'currentPassword', message: CURRENT_PASSWORD_WRONG }]);
  }
  if (input.newPassword === input.currentPassword) {
    throw new ValidationError([{ path: 'newPassword', message: 'Choose a password different from the current one.' }]);
  }
  user.passwordHash = await hashPassword(input.newPassword);
  await em.flush();
  // A reset link asked for before the change must not undo it.
  await em.nativeDelete(PasswordResetTokenSchema, { user: user.id });
  const endedSessions = await endSessionsOf(em, user.id, req.sessionID);
  await queuePasswordChanged(em, queue, user, clock.now(), 'from a signed-in session');
  req.log?.info({ event: 'password_changed', userId: user.id, endedSessions }, 'password changed');
  return { endedSessions };
}

/**
 * "Forgot password": counts the request (per address and per IP, whether or not the address has an
 * account) and, for an active account, queues the reset e-mail. The caller answers the same either way.
 */
export async function requestPasswordReset(
  { em, req, limiter, queue }: ResetRequestContext,
  email: string,
): Promise<void> {
  await limiter.consume(email, req.ip ?? 'unknown');
  const user = await em.findOne(UserSchema, { email }, { populate: ['company'] });
  if (!user || !user.active) {
    req.log?.info({ event: 'password_reset_unknown' }, 'password reset asked for an address without an account');
    return;
  }
  await queueMessage(em, queue, {
    companyId: user.company.id,
    userId: user.id,
    kind: 'password-reset',
    to: user.email,
    subject: 'Set a new Gaugeline password',
    text: null, // made when sent, with a fresh link (composeResetMessage)
  });
  req.log?.info({ event: 'password_reset_requested', userId: user.id }, 'password reset e-mail queued');
}

/**
 * The body of a password-reset e-mail, made by the queue's worker at the moment it is sent: a new
 * 256-bit token whose SHA-256 alone is stored, valid for RESET_LINK_MINUTES from now. The token is in
 * the URL's fragment, which browsers never send to a server (no logs, no Referer). Null when the
 * account is gone or deactivated meanwhile.
 */
export async function composeResetMessage(
  em: EntityManager,
  message: OutgoingMessage,
  deps: { clock: Clock; appOrigin: string },
): Promise<string | null> {
  const user = message.user ? await em.findOne(UserSchema, { id: message.user.id }) : null;
  if (!user || !user.active) return null;
  const token = randomBytes(32).toString('base64url');
  const now = deps.clock.now();
  await em.nativeDelete(PasswordResetTokenSchema, { user: user.id, expiresAt: { $lte: now } });
  em.create(PasswordResetTokenSchema, {
    user,
    tokenHash: sha256(token),
    createdAt: now,
    expiresAt: new Date(now.getTime() + RESET_LINK_MINUTES * 60_000),
  });
  await em.flush();
  const link = `${deps.appOrigin.replace(/\/$/, '')}${RESET_PASSWORD_PATH}#token=${token}`;
  return (
    `Hello ${user.name},\n\nSomeone (we hope you) asked to set a new password for your Gaugeline account. ` +
    `Open this link within ${RESET_LINK_MINUTES} minutes to choose one:\n\n${link}\n\n` +
    `The link works once. If you did not ask, ignore this e-mail: your password stays as it is.\n`
  );
}

/**
 * Sets a new password from a reset link: the token must exist and be unexpired; it is used up with
 * every other token of the user, every session of the user ends, and they are told by e-mail.
 */
export async function completePasswordReset(
  { em, clock, limiter, queue }: ResetContext,
  input: { token: string; password: string },
): Promise<void> {
  const now = clock.now();
  const row = await em.findOne(PasswordResetTokenSchema, { tokenHash: sha256(input.token) });
  if (!row || row.expiresAt.getTime() <= now.getTime()) throw new BadRequestError(RESET_LINK_INVALID);
  // Deleting is what uses it up: of two requests racing with one token, only one deletes the row.
  if ((await em.nativeDelete(PasswordResetTokenSchema, { id: row.id })) !== 1) {
    throw new BadRequestError(RESET_LINK_INVALID);
  }
  const user = await em.findOne(UserSchema, { id: row.user.id }, { populate: ['company', 'passwordHash'] });
  if (!user || !user.active) throw new BadRequestError(RESET_LINK_INVALID);
  user.passwordHash = await hashPassword(input.password);
  await em.flush();
  await em.nativeDelete(PasswordResetTokenSchema, { user: user.id });
  await endSessionsOf(em, user.id);
  // Whoever was locked out by failed sign-ins may sign in with the new password at once.
  await limiter.recordSuccess(user.email);
  await queuePasswordChanged(em, queue, user, now, 'with an e-mailed reset link');
}
