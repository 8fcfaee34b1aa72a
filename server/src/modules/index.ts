import { RequestContext } from '@mikro-orm/core';
import type { Express } from 'express';
import { createApiRouter, type ApiRouter } from '../lib/route';
import type { Services } from '../services/services';
import { authRoutes } from './auth/auth.routes';
import { createLoginLimiter } from './auth/rate-limit';
import { createResetLimiter } from './auth/reset-limit';
import { createLinkOpenLimiter } from './proposal-links/link-open-limit';
import { outboxRoutes } from './dev/outbox.routes';
import { docsPageRoutes, docsRoutes } from './docs/docs.routes';
import { healthRoutes } from './health/health.routes';
import { staffRoutes } from './users/staff.routes';
import { userRoutes } from './users/user.routes';
import { companySettingsRoutes } from './company-settings/company-settings.routes';
import { proposalDetailsRoutes } from './company-settings/proposal-details.routes';
import { customerRoutes } from './customers/customer.routes';
import { jobRoutes } from './jobs/job.routes';
import { lossReasonRoutes } from './jobs/loss-reasons.routes';
import { mailRoutes } from './mail/mail.routes';
import { loadsRoutes } from './loads/loads.routes';
import { photoRoutes } from './photos/photo.routes';
import { roomRoutes } from './rooms/room.routes';
import { companyDataRoutes } from './company-data/company-data.routes';
import { deskRoutes } from './desk/desk.routes';
import { paymentHooks } from './payments/payments.hooks';
import { proposalPdfRoutes } from './proposals/proposal-pdf.routes';
import { paymentRoutes } from './payments/payments.routes';
import { proposalRoutes } from './proposals/proposal.routes';
import { customerProposalRoutes, linkOpenRoutes, proposalLinkRoutes } from './proposal-links/proposal-link.routes';
import { customerAfterSigningRoutes, officeCancellationRoutes } from './cancellations/cancellation.routes';
import { officeSigningRoutes, signingRoutes } from './signing/signing.routes';
import { assignmentRoutes, myJobsRoutes } from './install/assignment.routes';
import { packetRoutes } from './install/packet.routes';
import {
  certificationRoutes,
  commissioningPolicyRoutes,
  commissioningRoutes,
} from './commissioning/commissioning.routes';
import { reportsRoutes } from './reports/reports.routes';

/** A module's routes under /api<prefix> (tests add their own through createApp's extras). */
export type ModuleMount = readonly [prefix: string, register: (api: ApiRouter) => void];

/**
 * Signed webhooks, under /api/hooks<prefix>: mounted before the JSON parser, the session and CSRF, so
 * each gets its body as received and answers to its signature only (lib/route.ts `signed`).
 */
const hooks = (services: Services): readonly ModuleMount[] => [
  [
    '/payments',
    paymentHooks(
      () => services.payments,
      () => services.queue,
    ),
  ],
];

export function mountHooks(app: Express, services: Services, extra: readonly ModuleMount[] = []): void {
  for (const [prefix, register] of [...hooks(services), ...extra]) {
    const api = createApiRouter(`/api/hooks${prefix}`, () => services, { raw: true });
    register(api);
    app.use(`/api/hooks${prefix}`, (_req, _res, next) => RequestContext.create(services.orm.em, next), api.router);
  }
}

/** Every API module, mounted under /api. Each route is made through createApiRouter, so each has a policy. */
export function mountModules(app: Express, services: Services, extra: readonly ModuleMount[] = []): void {
  const mount = (prefix: string, register: (api: ApiRouter) => void) => {
    const api = createApiRouter(`/api${prefix}`, () => services);
    register(api);
    app.use(`/api${prefix}`, api.router);
  };
  const limiter = createLoginLimiter(services.config, services.sessionPool);
  mount('/health', healthRoutes);
  mount('/openapi.json', docsRoutes);
  mount('/docs', docsPageRoutes);
  const resetLimiter = createResetLimiter(services.config, services.sessionPool);
  mount('/auth', (api) => authRoutes(api, limiter, resetLimiter));
  mount('/users', userRoutes);
  mount('/staff', staffRoutes);
  mount('/dev', outboxRoutes);
  mount('/mail', mailRoutes);
  mount('/company', companySettingsRoutes);
  mount('/company', lossReasonRoutes);
  mount('/company', proposalDetailsRoutes);
  mount('/customers', customerRoutes);
  mount('/jobs', jobRoutes);
  mount('/jobs', roomRoutes);
  mount('/jobs', photoRoutes);
  mount('/jobs', loadsRoutes);
  mount('/jobs', deskRoutes);
  mount('/jobs', proposalPdfRoutes);
  mount('/jobs', proposalRoutes);
  mount('/jobs', proposalLinkRoutes);
  mount('/jobs', officeCancellationRoutes);
  mount('/jobs', officeSigningRoutes);
  mount('/jobs', commissioningRoutes);
  mount('/jobs', assignmentRoutes);
  mount('/jobs', packetRoutes);
  mount('/my-jobs', myJobsRoutes);
  mount('/company', commissioningPolicyRoutes);
  mount('/me', certificationRoutes);
  mount('/company-data', companyDataRoutes);
  mount('/proposals', paymentRoutes);
  mount('/proposals', customerProposalRoutes);
  mount('/proposals', customerAfterSigningRoutes);
  mount('/proposals', signingRoutes);
  const linkLimiter = createLinkOpenLimiter(services.config, services.sessionPool);
  mount('/links', (api) => linkOpenRoutes(api, linkLimiter));
  mount('/reports', reportsRoutes);
  for (const [prefix, register] of extra) mount(prefix, register);
}
