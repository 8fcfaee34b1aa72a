import type { Express } from 'express';
import { createApiRouter } from '../lib/route';
import type { Services } from '../services/services';
import { authRoutes } from './auth/auth.routes';
import { createLoginLimiter } from './auth/rate-limit';
import { createResetLimiter } from './auth/reset-limit';
import { outboxRoutes } from './dev/outbox.routes';
import { healthRoutes } from './health/health.routes';
import { staffRoutes } from './users/staff.routes';
import { userRoutes } from './users/user.routes';
import { companySettingsRoutes } from './company-settings/company-settings.routes';
import { customerRoutes } from './customers/customer.routes';
import { jobRoutes } from './jobs/job.routes';
import { mailRoutes } from './mail/mail.routes';
import { loadsRoutes } from './loads/loads.routes';
import { photoRoutes } from './photos/photo.routes';
import { roomRoutes } from './rooms/room.routes';
import { companyDataRoutes } from './company-data/company-data.routes';

/** Every API module, mounted under /api. Each route is made through createApiRouter, so each has a policy. */
export function mountModules(app: Express, services: Services): void {
  const mount = (prefix: string, register: (api: ReturnType<typeof createApiRouter>) => void) => {
    const api = createApiRouter(`/api${prefix}`, () => services);
    register(api);
    app.use(`/api${prefix}`, api.router);
  };
  const limiter = createLoginLimiter(services.config, services.sessionPool);
  mount('/health', healthRoutes);
  const resetLimiter = createResetLimiter(services.config, services.sessionPool);
  mount('/auth', (api) => authRoutes(api, limiter, resetLimiter));
  mount('/users', userRoutes);
  mount('/staff', staffRoutes);
  mount('/dev', outboxRoutes);
  mount('/mail', mailRoutes);
  mount('/company', companySettingsRoutes);
  mount('/customers', customerRoutes);
  mount('/jobs', jobRoutes);
  mount('/jobs', roomRoutes);
  mount('/jobs', photoRoutes);
  mount('/jobs', loadsRoutes);
  mount('/company-data', companyDataRoutes);
}
