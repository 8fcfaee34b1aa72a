import { sessionsEndedResponse, userResponse, usersResponse } from '@contract';
import { OWNER, type ApiRouter } from '../../lib/route';
import { presentUser } from './user.presenter';
import { createUserSchema, updateUserSchema, userIdParams } from './user.schema';
import { createUser, endUserSessions, getUser, listUsers, updateUser } from './user.service';

export function userRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: OWNER,
    response: usersResponse,
    handler: async ({ em, actor }) => ({ users: (await listUsers(em, actor)).map(presentUser) }),
  });
  api.route({
    method: 'get',
    path: '/:id',
    policy: OWNER,
    params: userIdParams,
    response: userResponse,
    handler: async ({ em, actor, params }) => ({ user: presentUser(await getUser(em, actor, params.id)) }),
  });
  api.route({
    method: 'post',
    path: '/',
    policy: OWNER,
    body: createUserSchema,
    status: 201,
    response: userResponse,
    handler: async ({ em, actor, body, services }) => ({
      user: presentUser(await createUser(em, actor, services.queue, body)),
    }),
  });
  api.route({
    method: 'patch',
    path: '/:id',
    policy: OWNER,
    params: userIdParams,
    body: updateUserSchema,
    response: userResponse,
    handler: async ({ em, actor, params, body }) => ({
      user: presentUser(await updateUser(em, actor, params.id, body)),
    }),
  });
  api.route({
    method: 'post',
    path: '/:id/end-sessions',
    policy: OWNER,
    params: userIdParams,
    response: sessionsEndedResponse,
    handler: async ({ em, actor, params, req }) => ({
      ended: await endUserSessions(em, actor, params.id, req.sessionID),
    }),
  });
}
