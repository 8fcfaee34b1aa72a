import { z } from 'zod';
import { INSTALLER_ROLES, installPacket, OFFICE_ROLES } from '@contract';
import { rawResponse, roles, type ApiRouter } from '../../lib/route';
import { packetPdfBytes, requestPacketPdf } from './packet-pdf.service';
import { getPacket } from './packet.service';

const jobParams = z.strictObject({ jobId: z.uuid({ message: 'Must be a job id.' }) });
const pdfQuery = z.strictObject({ download: z.enum(['1'], { error: 'download is 1 or absent' }).optional() });
const pdfState = installPacket.shape.pdf;

/** Who reads a packet: the office, and the installers assigned to the job (assertInstallerMayOpen). */
const PACKET_READERS = roles(...OFFICE_ROLES, ...INSTALLER_ROLES);

/** Mounted under /api/jobs. */
export function packetRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/packet',
    policy: PACKET_READERS,
    summary: 'The job packet: what was sold, for the installers (no prices)',
    params: jobParams,
    response: installPacket,
    handler: async ({ service, params }) => getPacket(service, params.jobId),
  });
  api.route({
    method: 'post',
    path: '/:jobId/packet/pdf',
    policy: PACKET_READERS,
    summary: 'Makes the packet’s PDF again in the background (its state in the answer and in the packet)',
    params: jobParams,
    status: 202,
    response: pdfState,
    handler: async ({ service, params, services }) =>
      requestPacketPdf({ ...service, queue: services.queue }, params.jobId),
  });
  api.route({
    method: 'get',
    path: '/:jobId/packet/pdf',
    policy: PACKET_READERS,
    summary: 'The packet’s PDF (409 until made)',
    params: jobParams,
    query: pdfQuery,
    response: rawResponse('application/pdf'),
    handler: async ({ service, params, query, services, res }) => {
      const pdf = await packetPdfBytes({ ...service, storage: services.storage }, params.jobId);
      res
        .status(200)
        .setHeader('Content-Type', 'application/pdf')
        .setHeader('ETag', `"${pdf.sha256}"`)
        .setHeader('Content-Disposition', `${query.download ? 'attachment' : 'inline'}; filename="${pdf.fileName}"`)
        .setHeader('X-Content-Type-Options', 'nosniff')
        .setHeader('Content-Length', String(pdf.bytes.length))
        .setHeader('Content-Security-Policy', "default-src 'none'; object-src 'self'; frame-ancestors 'self'")
        .end(pdf.bytes);
      return undefined;
    },
  });
}
