import type { ApiRouter } from '../../lib/route';
import { ANY_STAFF, PUBLIC } from '../../lib/route';
import { UserSchema } from '../users/user.entity';
import { presentUser } from '../users/user.presenter';
import { loginSchema } from './auth.schema';
import { csrfToken, signIn, signOut } from './auth.service';
import type { LoginLimiter } from './rate-limit';

export function authRoutes(api: ApiRouter, limiter: LoginLimiter): void {
  api.route({
    method: 'get',
    path: '/csrf',
    policy: PUBLIC,
    handler: async ({ req }) => ({ token: await csrfToken(req) }),
  });

  api.route({
    method: 'post',
    path: '/login',
    policy: PUBLIC,
    body: loginSchema,
    handler: async ({ em, req, body, services }) => ({
      user: presentUser(await signIn(em, req, limiter, services.clock, body)),
    }),
  });

  api.route({
    method: 'post',
    path: '/logout',
    policy: PUBLIC,
    handler: async ({ req, res }) => {
      await signOut(req);
      res.status(204).end();
      return undefined;
    },
  });

  api.route({
    method: 'get',
    path: '/me',
    policy: ANY_STAFF,
    handler: async ({ actor, em }) => {
      const user = await em.findOneOrFail(UserSchema, { id: actor.userId }, { populate: ['company'] });
      return {
        user: presentUser(user),
        company: { id: user.company.id, name: user.company.name, unitSystem: user.company.unitSystem },
      };
    },
  });
}
