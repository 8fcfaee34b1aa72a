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
    handler: async ({ service }) => ({ users: (await listUsers(service)).map(presentUser) }),
  });
  api.route({
    method: 'get',
    path: '/:id',
    policy: OWNER,
    params: userIdParams,
    response: userResponse,
    handler: async ({ service, params }) => ({ user: presentUser(await getUser(service, params.id)) }),
  });
  api.route({
    method: 'post',
    path: '/',
    policy: OWNER,
    body: createUserSchema,
    status: 201,
    response: userResponse,
    handler: async ({ service, body, services }) => ({
      user: presentUser(await createUser({ ...service, queue: services.queue }, body)),
    }),
  });
  api.route({
    method: 'patch',
    path: '/:id',
    policy: OWNER,
    params: userIdParams,
    body: updateUserSchema,
    response: userResponse,
    handler: async ({ service, params, body }) => ({
      user: presentUser(await updateUser(service, params.id, body)),
    }),
  });
  api.route({
    method: 'post',
    path: '/:id/end-sessions',
    policy: OWNER,
    params: userIdParams,
    response: sessionsEndedResponse,
    handler: async ({ service, params, req }) => ({
      ended: await endUserSessions(service, params.id, req.sessionID),
    }),
  });
}
