import { z } from 'zod';
import { proposalDiffResponse, proposalResponse, proposalVersionResponse } from '@contract';
import { JOB_EDITORS, OFFICE, type ApiRouter } from '../../lib/route';
import { uuidParam } from '../../lib/validate';
import { renderPdfAfterIssue } from './pdf-hook';
import { diffVersions, getProposal, getVersion, issueVersion } from './proposal.service';

const jobParams = z.strictObject({ jobId: uuidParam });
const number = z.coerce.number({ error: 'A version number is a whole number from 1.' }).int().min(1).max(100000);
const versionParams = z.strictObject({ jobId: uuidParam, n: number });
const diffParams = z.strictObject({ jobId: uuidParam, a: number, b: number });

/** A job's proposal (issue 14): issue a frozen version, read the versions, the audit trail and what changed. */
export function proposalRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/proposal',
    policy: JOB_EDITORS,
    summary: "The job's proposal: its versions, its audit trail in order, and whether a version may be issued",
    params: jobParams,
    response: proposalResponse,
    handler: async ({ service, params }) => getProposal(service, params.jobId),
  });
  api.route({
    method: 'post',
    path: '/:jobId/proposal/versions',
    policy: OFFICE,
    summary: 'Issues the next version: recomputed by the server from the saved inputs and frozen (409 unless ready)',
    params: jobParams,
    status: 201,
    response: proposalResponse,
    handler: async ({ service, services, params }) => {
      await issueVersion(service, params.jobId, renderPdfAfterIssue(services));
      return getProposal(service, params.jobId);
    },
  });
  api.route({
    method: 'get',
    path: '/:jobId/proposal/versions/:n',
    policy: JOB_EDITORS,
    summary: 'One version with its frozen snapshot',
    params: versionParams,
    response: proposalVersionResponse,
    handler: async ({ service, params }) => getVersion(service, params.jobId, params.n),
  });
  api.route({
    method: 'get',
    path: '/:jobId/proposal/versions/:a/diff/:b',
    policy: JOB_EDITORS,
    summary: 'What changed from version a to version b, in sentences',
    params: diffParams,
    response: proposalDiffResponse,
    handler: async ({ service, params }) => diffVersions(service, params.jobId, params.a, params.b),
  });
}
