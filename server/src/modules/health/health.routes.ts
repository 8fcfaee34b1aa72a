import { PUBLIC, type ApiRouter } from '../../lib/route';

export function healthRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: PUBLIC,
    handler: async ({ services, res }) => {
      const up = await services.orm.em
        .getConnection()
        .execute('select 1')
        .then(() => true)
        .catch(() => false);
      res.status(up ? 200 : 503).json({ status: up ? 'ok' : 'degraded', db: up ? 'ok' : 'down' });
      return undefined;
    },
  });
}
