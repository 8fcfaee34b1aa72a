import { z } from 'zod';
import { proposalResponse } from '@contract';
import { OFFICE, rawResponse, type ApiRouter } from '../../lib/route';
import { retryPdfRender, versionPdf } from './proposal-pdf.service';
import { getProposal } from './proposal.service';

const versionParams = z.object({
  jobId: z.uuid({ message: 'Must be a job id.' }),
  n: z.coerce
    .number({ error: 'Must be a version number.' })
    .int('Must be a version number.')
    .min(1, 'Must be a version number.')
    .max(100_000, 'Must be a version number.'),
});
const pdfQuery = z.strictObject({
  /** `1`: as a download (attachment) rather than shown in the page. */
  download: z.enum(['1'], { error: 'download is 1 or absent' }).optional(),
});

/**
 * Mounted under /api/jobs. The PDF as stored when it was rendered (its SHA-256 is on the version and in the
 * ETag). It may be shown in a frame of the app (the office's preview), so this answer's own CSP lets the
 * app frame it and lets the browser's PDF viewer run, and nothing else.
 */
export function proposalPdfRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/proposal/versions/:n/pdf',
    policy: OFFICE,
    params: versionParams,
    query: pdfQuery,
    summary: 'A proposal version’s PDF (409 while it is being prepared)',
    response: rawResponse('application/pdf'),
    handler: async ({ service, services, params, query, res }) => {
      const pdf = await versionPdf({ ...service, storage: services.storage }, params.jobId, params.n);
      res
        .status(200)
        .setHeader('Content-Type', 'application/pdf')
        .setHeader('Content-Disposition', `${query.download ? 'attachment' : 'inline'}; filename="${pdf.fileName}"`)
        .setHeader('Content-Length', String(pdf.bytes.length))
        .setHeader('ETag', `"${pdf.sha256}"`)
        .setHeader('Cache-Control', 'private, no-cache')
        .setHeader('X-Content-Type-Options', 'nosniff')
        .setHeader('X-Frame-Options', 'SAMEORIGIN')
        .setHeader('Content-Security-Policy', "default-src 'none'; object-src 'self'; frame-ancestors 'self'")
        .end(pdf.bytes);
      return undefined;
    },
  });
  api.route({
    method: 'post',
    path: '/:jobId/proposal/versions/:n/pdf/retry',
    policy: OFFICE,
    params: versionParams,
    summary: 'Queues a failed PDF again (409 unless it failed); answers with the proposal',
    response: proposalResponse,
    handler: async ({ service, services, params }) => {
      await retryPdfRender({ ...service, queue: services.queue }, params.jobId, params.n);
      return getProposal(service, params.jobId);
    },
  });
}
