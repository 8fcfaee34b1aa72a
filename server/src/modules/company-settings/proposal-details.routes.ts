import { z } from 'zod';
import { proposalDetailsBody, proposalDetailsResponse } from '@contract';
import { ANY_STAFF, NO_CONTENT, OWNER, rawResponse, type ApiRouter } from '../../lib/route';
import { receiveUpload } from '../../lib/receive-upload';
import { presentProposalDetails } from './proposal-details.presenter';
import { getProposalDetails, logoBytes, putProposalDetails, removeLogo, setLogo } from './proposal-details.service';

const logoParams = z.object({ logoId: z.uuid({ message: 'Must be a logo id.' }) });

/** Mounted under /api/company: what every proposal carries (the owner edits it) and the logo. */
export function proposalDetailsRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/proposal-details',
    policy: ANY_STAFF,
    response: proposalDetailsResponse,
    versioned: (out) => out.details.version,
    handler: async ({ service }) => {
      const v = await getProposalDetails(service);
      return { details: presentProposalDetails(v.row, v.logo) };
    },
  });
  api.route({
    method: 'put',
    path: '/proposal-details',
    policy: OWNER,
    body: proposalDetailsBody,
    response: proposalDetailsResponse,
    versioned: (out) => out.details.version,
    handler: async ({ service, body, ifMatch }) => {
      const v = await putProposalDetails(service, ifMatch, body);
      return { details: presentProposalDetails(v.row, v.logo) };
    },
  });
  api.route({
    method: 'post',
    path: '/proposal-details/logo',
    policy: OWNER,
    multipart: true,
    summary: 'Upload the logo (JPEG, PNG or WebP; checked by content, re-encoded to PNG)',
    response: proposalDetailsResponse,
    handler: async ({ service, services, req, res }) => {
      const file = await receiveUpload(req, res, services.config.UPLOAD_MAX_BYTES, 'logo');
      const v = await setLogo({ ...service, storage: services.storage }, file);
      return { details: presentProposalDetails(v.row, v.logo) };
    },
  });
  api.route({
    method: 'delete',
    path: '/proposal-details/logo',
    policy: OWNER,
    response: NO_CONTENT,
    handler: async ({ service, services }) => {
      await removeLogo({ ...service, storage: services.storage });
    },
  });
  api.route({
    method: 'get',
    path: '/logo/:logoId',
    policy: ANY_STAFF,
    params: logoParams,
    summary: 'The logo (PNG, re-encoded without metadata)',
    response: rawResponse('image/png'),
    handler: async ({ service, services, params, res }) => {
      const { logo, bytes } = await logoBytes({ ...service, storage: services.storage }, params.logoId);
      res
        .status(200)
        .setHeader('Content-Type', logo.contentType)
        .setHeader('X-Content-Type-Options', 'nosniff')
        .setHeader('Content-Disposition', `inline; filename="logo-${logo.id}.png"`)
        .setHeader('Cache-Control', 'private, max-age=86400, immutable')
        .setHeader('Content-Length', String(bytes.length))
        .end(bytes);
      return undefined;
    },
  });
}
