import { z } from 'zod';
import { mailMessageResponse, mailMessagesResponse } from '@contract';
import { OWNER, type ApiRouter } from '../../lib/route';
import { presentMessage } from './mail.presenter';
import { listMessages, retryMessage } from './mail.service';

const messageIdParams = z.strictObject({ id: z.uuid({ message: 'Must be a message id.' }) });

/** The owner's E-mail page: what the app sent or is trying to send for the company, and "Try again". */
export function mailRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: OWNER,
    response: mailMessagesResponse,
    handler: async ({ service }) => ({ messages: (await listMessages(service)).map(presentMessage) }),
  });
  api.route({
    method: 'post',
    path: '/:id/retry',
    policy: OWNER,
    params: messageIdParams,
    response: mailMessageResponse,
    handler: async ({ service, params, services }) => ({
      message: presentMessage(await retryMessage({ ...service, queue: services.queue }, params.id)),
    }),
  });
}
