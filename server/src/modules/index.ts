import type { Express } from 'express';
import { createApiRouter } from '../lib/route';
import type { Services } from '../services/services';
import { authRoutes } from './auth/auth.routes';
import { createLoginLimiter } from './auth/rate-limit';
import { outboxRoutes } from './dev/outbox.routes';
import { healthRoutes } from './health/health.routes';
import { userRoutes } from './users/user.routes';

/** Every API module, mounted under /api. Each route is made through createApiRouter, so each has a policy. */
export function mountModules(app: Express, services: Services): void {
  const mount = (prefix: string, register: (api: ReturnType<typeof createApiRouter>) => void) => {
    const api = createApiRouter(`/api${prefix}`, () => services);
    register(api);
    app.use(`/api${prefix}`, api.router);
  };
  const limiter = createLoginLimiter(services.config, services.sessionPool);
  mount('/health', healthRoutes);
  mount('/auth', (api) => authRoutes(api, limiter));
  mount('/users', userRoutes);
  mount('/dev', outboxRoutes);
}
