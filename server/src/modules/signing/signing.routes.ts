import type { Response } from 'express';
import { z } from 'zod';
import { consentBody, signatureBody, signingState } from '@contract';
import { link, OFFICE, rawResponse, type ApiRouter } from '../../lib/route';
import { liveLink } from '../proposal-links/link-open';
import { customerSignedPdf, officeSignedPdf } from './signed-pdf.service';
import { requestMeta as metaOf } from '../../lib/request-meta';
import { giveConsent, signingState as readSigningState, signVersion } from './signing.service';

const proposalParams = z.strictObject({ proposalId: z.uuid() });

/** A signed copy as a download: attachment, its SHA-256 as the ETag, nothing that stops saving or printing. */
function sendPdf(res: Response, pdf: { bytes: Buffer; fileName: string; sha256: string }) {
  res
    .status(200)
    .setHeader('Content-Type', 'application/pdf')
    .setHeader('Content-Disposition', `attachment; filename="${pdf.fileName}"`)
    .setHeader('Content-Length', String(pdf.bytes.length))
    .setHeader('ETag', `"${pdf.sha256}"`)
    .setHeader('Cache-Control', 'private, no-cache')
    .setHeader('X-Content-Type-Options', 'nosniff')
    .setHeader('Content-Security-Policy', "default-src 'none'")
    .end(pdf.bytes);
}

/**
 * The customer's signing, under /api/proposals (a proposal-link session, `link('proposalId')`, whose link
 * must still work: revoked, expired or superseded is 410 with why and whom to contact): the state of signing, the consent to sign electronically (ESIGN §7001(c)), the signature, and the signed copy.
 */
export function signingRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:proposalId/signing',
    summary: 'Where signing the current version stands: the consent text, the statement to sign, the signature',
    policy: link('proposalId'),
    params: proposalParams,
    response: signingState,
    handler: async ({ em, link: grant, services }) => {
      await liveLink(em, services.clock, grant!);
      return readSigningState(em, grant!);
    },
  });
  api.route({
    method: 'post',
    path: '/:proposalId/consent',
    summary: 'Agree to sign electronically (ESIGN, 15 U.S.C. §7001(c)(1)); recorded with the text shown',
    policy: link('proposalId'),
    params: proposalParams,
    body: consentBody,
    status: 200,
    response: signingState,
    handler: async ({ em, link: grant, body, req, services }) => {
      await liveLink(em, services.clock, grant!);
      return giveConsent(em, { clock: services.clock }, grant!, body, metaOf(req));
    },
  });
  api.route({
    method: 'post',
    path: '/:proposalId/signature',
    summary: 'Sign the current version (drawn or typed), after consent and an option chosen',
    policy: link('proposalId'),
    params: proposalParams,
    body: signatureBody,
    status: 201,
    response: signingState,
    handler: async ({ em, link: grant, body, req, services }) => {
      await liveLink(em, services.clock, grant!);
      return signVersion(
        em,
        { clock: services.clock, storage: services.storage, queue: services.queue },
        grant!,
        body,
        metaOf(req),
      );
    },
  });
  api.route({
    method: 'get',
    path: '/:proposalId/signed-pdf',
    summary: 'The signed, sealed copy (409 while it is being made or before signing)',
    policy: link('proposalId'),
    params: proposalParams,
    response: rawResponse('application/pdf'),
    handler: async ({ em, link: grant, services, res }) => {
      await liveLink(em, services.clock, grant!);
      sendPdf(res, await customerSignedPdf(em, services.storage, grant!.companyId, grant!.proposalId));
      return undefined;
    },
  });
}

const versionParams = z.object({
  jobId: z.uuid({ message: 'Must be a job id.' }),
  n: z.coerce
    .number({ error: 'Must be a version number.' })
    .int('Must be a version number.')
    .min(1, 'Must be a version number.')
    .max(100_000, 'Must be a version number.'),
});

/** The office's download of a signed copy, under /api/jobs. */
export function officeSigningRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/proposal/versions/:n/signed-pdf',
    summary: 'A version’s signed, sealed copy (409 unsigned or while it is being made)',
    policy: OFFICE,
    params: versionParams,
    response: rawResponse('application/pdf'),
    handler: async ({ service, services, params, res }) => {
      sendPdf(res, await officeSignedPdf({ ...service, storage: services.storage }, params.jobId, params.n));
      return undefined;
    },
  });
}
