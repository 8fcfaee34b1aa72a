import { z } from 'zod';
import { afterSigningRecord, customerCancellationBody, officeCancellationBody } from '@contract';
import { NotFoundError } from '../../lib/errors';
import { link, OFFICE, type ApiRouter } from '../../lib/route';
import { uuidParam } from '../../lib/validate';
import { afterSigning, cancelProposal } from './cancellation.service';

const proposalParams = z.strictObject({ proposalId: z.uuid() });

/**
 * The customer's side after signing (a proposal-link session, `link('proposalId')`): what the page shows
 * (the right-to-cancel window, the deposit's state as the payment webhooks left it, any cancellation) and
 * the cancellation itself. Mounted under /api/proposals.
 */
export function customerAfterSigningRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:proposalId/after-signing',
    summary: 'After the signature: the last day to cancel, the deposit and any cancellation',
    policy: link('proposalId'),
    params: proposalParams,
    response: afterSigningRecord,
    handler: async ({ em, link: grant, params, services }) =>
      afterSigning(em, services, grant!.companyId, params.proposalId),
  });
  api.route({
    method: 'post',
    path: '/:proposalId/cancellation',
    summary:
      'The buyer cancels the signed proposal within three business days (16 CFR 429.1): the job becomes lost and a paid deposit is refunded',
    policy: link('proposalId'),
    params: proposalParams,
    body: customerCancellationBody,
    status: 201,
    response: afterSigningRecord,
    handler: async ({ em, req, link: grant, params, body, services }) => {
      await cancelProposal(em, services, grant!.companyId, params.proposalId, {
        kind: 'customer',
        ip: req.ip ?? null,
        userAgent: req.get('User-Agent') ?? null,
        reason: body.reason,
      });
      return afterSigning(em, services, grant!.companyId, params.proposalId);
    },
  });
}

/**
 * The office records a cancellation the buyer mailed or delivered inside the window (owner, estimator):
 * the same effects as the buyer's own. Mounted under /api/jobs.
 */
export function officeCancellationRoutes(api: ApiRouter): void {
  api.route({
    method: 'post',
    path: '/:jobId/proposal/cancellation',
    summary: "Records the buyer's mailed or delivered notice of cancellation (within the three business days)",
    policy: OFFICE,
    params: z.strictObject({ jobId: uuidParam }),
    body: officeCancellationBody,
    status: 201,
    response: afterSigningRecord,
    handler: async ({ em, actor, params, body, services }) => {
      const rows = await em.execute<Array<{ id: string }>>(
        'select "id" from "proposal" where "company_id" = ? and "job_id" = ?',
        [actor.companyId, params.jobId],
      );
      const proposalId = rows[0]?.id;
      if (!proposalId) throw new NotFoundError("The job's proposal");
      await cancelProposal(em, services, actor.companyId, proposalId, {
        kind: 'office',
        userId: actor.userId,
        body,
      });
      return afterSigning(em, services, actor.companyId, proposalId);
    },
  });
}
