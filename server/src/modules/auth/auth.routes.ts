import type { EntityManager } from '@mikro-orm/postgresql';
import type { ApiRouter } from '../../lib/route';
import { ANY_STAFF, NO_CONTENT, PUBLIC } from '../../lib/route';
import { UserSchema } from '../users/user.entity';
import { presentUser } from '../users/user.presenter';
import {
  csrfResponse,
  meResponse,
  sessionResponse,
  accountMessageResponse,
  passwordChangedResponse,
  RESET_REQUESTED_MESSAGE,
  userResponse,
  signInBody,
  changePasswordBody,
  passwordResetRequestBody,
  passwordResetBody,
} from '@contract';
import { csrfToken, signIn, signOut } from './auth.service';
import { changePassword, completePasswordReset, requestPasswordReset } from './password.service';
import type { LoginLimiter } from './rate-limit';
import type { ResetLimiter } from './reset-limit';

export function authRoutes(api: ApiRouter, limiter: LoginLimiter, resetLimiter: ResetLimiter): void {
  api.route({
    method: 'get',
    path: '/csrf',
    policy: PUBLIC,
    response: csrfResponse,
    handler: async ({ req }) => ({ token: await csrfToken(req) }),
  });

  api.route({
    method: 'post',
    path: '/login',
    policy: PUBLIC,
    body: signInBody,
    response: userResponse,
    handler: async ({ service, req, body }) => ({
      user: presentUser(await signIn({ ...service, req, limiter }, body)),
    }),
  });

  api.route({
    method: 'post',
    path: '/logout',
    policy: PUBLIC,
    response: NO_CONTENT,
    handler: async ({ req }) => {
      await signOut(req);
    },
  });

  const me = async (em: EntityManager, userId: string) => {
    const user = await em.findOneOrFail(UserSchema, { id: userId }, { populate: ['company'] });
    return {
      user: presentUser(user),
      company: { id: user.company.id, name: user.company.name, unitSystem: user.company.unitSystem },
    };
  };

  api.route({
    method: 'get',
    path: '/me',
    policy: ANY_STAFF,
    response: meResponse,
    handler: async ({ actor, em }) => me(em, actor.userId),
  });

  /** What the app asks on every load: being signed out is an answer (200, me: null), not a 401. */
  api.route({
    method: 'get',
    path: '/session',
    policy: PUBLIC,
    response: sessionResponse,
    handler: async ({ actor, em }) => ({ me: actor ? await me(em, actor.userId) : null }),
  });

  /** Change one's own password: other sessions end, this one stays. */
  api.route({
    method: 'post',
    path: '/password',
    policy: ANY_STAFF,
    body: changePasswordBody,
    response: passwordChangedResponse,
    handler: async ({ service, req, body, services }) =>
      changePassword({ ...service, req, limiter, queue: services.queue }, body),
  });

  /** "Forgot password": always the same 202 answer, whether or not the address has an account. */
  api.route({
    method: 'post',
    path: '/password-reset',
    policy: PUBLIC,
    body: passwordResetRequestBody,
    response: accountMessageResponse,
    status: 202,
    handler: async ({ service, req, body, services }) => {
      await requestPasswordReset({ ...service, req, limiter: resetLimiter, queue: services.queue }, body.email);
      return { message: RESET_REQUESTED_MESSAGE };
    },
  });

  /** The e-mailed link's form: a new password for the token's account; every session of it ends. */
  api.route({
    method: 'post',
    path: '/password-reset/complete',
    policy: PUBLIC,
    body: passwordResetBody,
    response: accountMessageResponse,
    handler: async ({ service, body, services }) => {
      await completePasswordReset({ ...service, limiter, queue: services.queue }, body);
      return { message: 'Your new password is set. Sign in with it.' };
    },
  });
}
