import { lossReasonsInput, lossReasonsResponse } from '@contract';
import { JOB_EDITORS, OWNER, type ApiRouter } from '../../lib/route';
import { lossReasonsOf, putLossReasons } from './loss-reasons.service';

/** The company's reasons a job is lost (mounted under /api/company): everyone who marks jobs reads, the owner edits. */
export function lossReasonRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/loss-reasons',
    policy: JOB_EDITORS,
    summary: 'The reasons a job may be marked lost with (the defaults until the owner saves a list)',
    response: lossReasonsResponse,
    versioned: (out) => out.lossReasons.version,
    handler: async ({ service }) => ({ lossReasons: await lossReasonsOf(service.em, service.actor.companyId) }),
  });
  api.route({
    method: 'put',
    path: '/loss-reasons',
    policy: OWNER,
    summary: 'Replaces the list of loss reasons (If-Match: the version read, "0" before the first save)',
    body: lossReasonsInput,
    response: lossReasonsResponse,
    versioned: (out) => out.lossReasons.version,
    handler: async ({ service, body, ifMatch }) => ({ lossReasons: await putLossReasons(service, ifMatch, body) }),
  });
}
