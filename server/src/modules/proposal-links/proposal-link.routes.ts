import { z } from 'zod';
import {
  chooseOptionBody,
  customerProposalPath,
  customerProposalView,
  proposalLinksResponse,
  sendProposalBody,
} from '@contract';
import { link, OFFICE, PUBLIC, rawResponse, type ApiRouter } from '../../lib/route';
import { requestMeta as metaOf } from '../../lib/request-meta';
import { uuidParam } from '../../lib/validate';
import { chooseOption, customerPdf, readCustomerProposal } from './customer-proposal.service';
import { linkEndedPage, openLink, tooManyTriesPage } from './link-open';
import type { LinkOpenLimiter } from './link-open-limit';
import { listLinks, revokeLink, sendProposal } from './proposal-link.service';

const jobParams = z.strictObject({ jobId: uuidParam });
const linkParams = z.strictObject({ jobId: uuidParam, linkId: uuidParam });
const proposalParams = z.strictObject({ proposalId: uuidParam });

/** The office's side, under /api/jobs: send the current version, list the links with their mail state, revoke one. */
export function proposalLinkRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/proposal/links',
    policy: OFFICE,
    summary: "The proposal's e-mailed links, newest first, with each one's mail state, and whether it may be sent now",
    params: jobParams,
    response: proposalLinksResponse,
    handler: async ({ service, params }) => listLinks(service, params.jobId),
  });
  api.route({
    method: 'post',
    path: '/:jobId/proposal/links',
    policy: OFFICE,
    summary:
      'Sends the current version to the address by e-mail with a new link (409 with no version, or when the job changed since)',
    params: jobParams,
    body: sendProposalBody,
    status: 201,
    response: proposalLinksResponse,
    handler: async ({ service, services, params, body }) => {
      await sendProposal({ ...service, queue: services.queue }, params.jobId, body.to);
      return listLinks(service, params.jobId);
    },
  });
  api.route({
    method: 'post',
    path: '/:jobId/proposal/links/:linkId/revoke',
    policy: OFFICE,
    summary: 'Withdraws a link: it, and any page it opened, stops working at once',
    params: linkParams,
    response: proposalLinksResponse,
    handler: async ({ service, params }) => {
      await revokeLink(service, params.jobId, params.linkId);
      return listLinks(service, params.jobId);
    },
  });
}

/**
 * GET /api/links/open?t=<token>: what a proposal e-mail's link opens. A live link: the session is
 * regenerated (a new id) and holds a grant for that one proposal, and the answer is 303 to the clean page
 * `/p/<proposal id>`, so the token leaves the address bar and history and is never sent as a Referer. An
 * ended, altered or unknown token: 410 with the "no longer works" page (why and whom to contact only for a
 * real link). Failed openings are counted per client address (link-open-limit.ts): past the limit, 429.
 * The token is in the query, which the request log never writes.
 */
export function linkOpenRoutes(api: ApiRouter, limiter: LinkOpenLimiter): void {
  api.route({
    method: 'get',
    path: '/open',
    policy: PUBLIC,
    summary: 'Opens a proposal link: 303 to the customer’s page with a session for that proposal, or 410 with a page',
    query: z.object({ t: z.string().optional().catch(undefined) }),
    response: rawResponse('text/html'),
    handler: async ({ req, res, em, services, query }) => {
      res.setHeader('Referrer-Policy', 'no-referrer');
      res.setHeader('Cache-Control', 'no-store');
      // An address that failed too often waits, whatever it sends now (guessing tokens is slowed to a crawl).
      const ip = req.ip ?? 'unknown';
      const wait = await limiter.blockedFor(ip);
      if (wait > 0) {
        res.status(429).setHeader('Retry-After', String(wait)).type('html').send(tooManyTriesPage());
        return undefined;
      }
      const outcome = await openLink(em, services.clock, query.t ?? '', {
        ip: req.ip ?? null,
        userAgent: req.get('user-agent') ?? null,
      });
      if (!outcome.ok) {
        await limiter.failed(ip);
        res.status(410).type('html').send(linkEndedPage(outcome.reason, outcome.contact));
        return undefined;
      }
      await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
      req.session.link = outcome.grant;
      await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
      res.redirect(303, customerProposalPath(outcome.grant.proposalId));
      return undefined;
    },
  });
}

/** The customer's side, under /api/proposals (a proposal-link session for that one proposal). */
export function customerProposalRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:proposalId',
    policy: link('proposalId'),
    summary: 'The proposal version the customer was sent, as they may read it (no costs or internal fields)',
    params: proposalParams,
    response: customerProposalView,
    handler: async ({ em, services, link: grant, req }) =>
      readCustomerProposal({ em, clock: services.clock, grant: grant!, meta: metaOf(req) }),
  });
  api.route({
    method: 'post',
    path: '/:proposalId/option',
    policy: link('proposalId'),
    summary: 'The customer chooses one of the options (again, until the proposal is signed)',
    params: proposalParams,
    body: chooseOptionBody,
    response: customerProposalView,
    handler: async ({ em, services, link: grant, req, body }) =>
      chooseOption({ em, clock: services.clock, grant: grant!, meta: metaOf(req) }, body.position),
  });
  api.route({
    method: 'get',
    path: '/:proposalId/pdf',
    policy: link('proposalId'),
    summary: 'The proposal’s PDF as a download (409 while it is being prepared)',
    params: proposalParams,
    response: rawResponse('application/pdf'),
    handler: async ({ em, services, link: grant, req, res }) => {
      const pdf = await customerPdf({
        em,
        clock: services.clock,
        grant: grant!,
        meta: metaOf(req),
        storage: services.storage,
      });
      res
        .status(200)
        .setHeader('Content-Type', 'application/pdf')
        .setHeader('Content-Disposition', `attachment; filename="${pdf.fileName}"`)
        .setHeader('Content-Length', String(pdf.bytes.length))
        .setHeader('Cache-Control', 'private, no-store')
        .setHeader('X-Content-Type-Options', 'nosniff')
        .end(pdf.bytes);
      return undefined;
    },
  });
}
