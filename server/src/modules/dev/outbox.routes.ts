import { NotFoundError } from '../../lib/errors';
import { outboxResponse } from '@contract';
import { OWNER, type ApiRouter } from '../../lib/route';

/** The local e-mail fake's outbox, for the owner while developing; absent in production. */
export function outboxRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/outbox',
    policy: OWNER,
    response: outboxResponse,
    handler: async ({ services }) => {
      if (!services.config.devOutbox || !services.outbox) throw new NotFoundError('The outbox');
      const messages = await services.outbox.list();
      return { messages: messages.slice(0, 200) };
    },
  });
}
