import { healthResponse } from '@contract';
import { PUBLIC, reply, type ApiRouter } from '../../lib/route';

export function healthRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: PUBLIC,
    summary: 'Up and reaching the database: 200 ok, or 503 degraded',
    response: healthResponse,
    handler: async ({ services }) => {
      const up = await services.orm.em
        .getConnection()
        .execute('select 1')
        .then(() => true)
        .catch(() => false);
      return up
        ? { status: 'ok' as const, db: 'ok' as const }
        : reply(503, { status: 'degraded', db: 'down' } as const);
    },
  });
}
