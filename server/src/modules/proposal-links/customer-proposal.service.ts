import type { EntityManager } from '@mikro-orm/postgresql';
import { proposalSnapshot, type CustomerProposalView, type ProposalEventKind } from '@contract';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import type { LinkGrant } from '../../lib/route';
import type { RequestMeta } from '../../lib/request-meta';
import type { Storage } from '../../services/storage';
import type { Clock } from '../../services/services';
import { versionIsSigned } from '../payments/payments.service';
import { pdfFileName } from '../proposals/proposal-pdf.service';
import { ProposalEventSchema, ProposalVersionSchema } from '../proposals/proposal.entity';
import { customerView } from './customer-view';
import { liveLink } from './link-open';
import type { ProposalLink } from './proposal-link.entity';

/**
 * The customer's side of a proposal (a `link('proposalId')` session): the version their link sent, read as
 * the customer view; its PDF; the option they choose. Each request checks the link still works, and each
 * act is on the audit trail with the browser's address and user agent.
 */

export interface CustomerContext {
  em: EntityManager;
  clock: Clock;
  grant: LinkGrant;
  /** The browser's address and user agent, as the trail keeps them (the route reads them from the request). */
  meta: RequestMeta;
}

function customerEvent(
  { em, clock, meta }: CustomerContext,
  link: ProposalLink,
  kind: ProposalEventKind,
  data: Record<string, unknown>,
) {
  em.create(ProposalEventSchema, {
    company: link.company,
    proposal: link.proposal,
    version: link.version,
    kind,
    at: clock.now(),
    byUser: null,
    byCustomer: true,
    ip: meta.ip?.slice(0, 45) ?? null,
    userAgent: meta.userAgent?.slice(0, 400) ?? null,
    data: { linkId: link.id, ...data },
  });
}

/** The latest option chosen on this version (the deposit reads the same event), or null. */
async function chosenOption(em: EntityManager, link: ProposalLink) {
  const rows = await em.execute<Array<{ position: string | null; at: Date }>>(
    `select "data"->>'position' as "position", "at" from "proposal_event"
     where "company_id" = ? and "version_id" = ? and "kind" = 'option-chosen' order by "seq" desc limit 1`,
    [link.company.id, link.version.id],
  );
  const row = rows[0];
  return row && row.position !== null ? { position: Number(row.position), at: new Date(row.at) } : null;
}

async function view(ctx: CustomerContext, link: ProposalLink): Promise<CustomerProposalView> {
  const version = link.version;
  const previous =
    version.number > 1
      ? await ctx.em.findOne(ProposalVersionSchema, {
          proposal: link.proposal.id,
          company: link.company.id,
          number: version.number - 1,
        })
      : null;
  return customerView({
    proposalId: link.proposal.id,
    number: version.number,
    issuedAt: version.issuedAt,
    snapshot: proposalSnapshot.parse(version.snapshot),
    previous: previous
      ? { number: previous.number, issuedAt: previous.issuedAt, snapshot: proposalSnapshot.parse(previous.snapshot) }
      : null,
    chosen: await chosenOption(ctx.em, link),
    pdfReady: version.pdfState === 'ready',
  });
}

/** GET /api/proposals/:proposalId. The first read in a session writes 'viewed'. */
export async function readCustomerProposal(ctx: CustomerContext): Promise<CustomerProposalView> {
  const link = await liveLink(ctx.em, ctx.clock, ctx.grant);
  if (!ctx.grant.viewed) {
    customerEvent(ctx, link, 'viewed', { versionNumber: link.version.number });
    await ctx.em.flush();
    ctx.grant.viewed = true;
  }
  return view(ctx, link);
}

/**
 * POST /api/proposals/:proposalId/option: the customer chooses one of the version's options ('option-chosen',
 * data.position — what the deposit reads). Choosing again before signing replaces the choice; a signed
 * version's choice is final (409). A position the version does not offer is a 400 naming the field.
 */
export async function chooseOption(ctx: CustomerContext, position: number): Promise<CustomerProposalView> {
  const link = await liveLink(ctx.em, ctx.clock, ctx.grant);
  const snapshot = proposalSnapshot.parse(link.version.snapshot);
  const option = snapshot.options.find((o) => o.position === position);
  if (!option) {
    const offered = snapshot.options.map((o) => o.position).join(', ');
    throw new ValidationError([{ path: 'position', message: `Choose one of the options offered (${offered}).` }]);
  }
  if (await versionIsSigned(ctx.em, link.company.id, link.version.id))
    throw new ConflictError('This proposal has been signed; the option chosen can no longer change.');
  customerEvent(ctx, link, 'option-chosen', {
    position: option.position,
    name: option.name,
    totalCents: option.price.totalCents,
  });
  await ctx.em.flush();
  return view(ctx, link);
}

/** GET /api/proposals/:proposalId/pdf: the version's PDF as stored ('downloaded'); 409 while it is made. */
export async function customerPdf(
  ctx: CustomerContext & { storage: Storage },
): Promise<{ bytes: Buffer; fileName: string; sha256: string }> {
  const link = await liveLink(ctx.em, ctx.clock, ctx.grant);
  const v = link.version;
  if (v.pdfState !== 'ready' || !v.pdfKey || !v.pdfSha256)
    throw new ConflictError('The PDF of this proposal is still being prepared. Try again in a minute.', {
      pdfState: v.pdfState,
    });
  const bytes = await ctx.storage.get(v.pdfKey);
  if (bytes === null) throw new NotFoundError('The PDF file');
  const sha256 = v.pdfSha256.trim();
  customerEvent(ctx, link, 'downloaded', { versionNumber: v.number, sha256 });
  await ctx.em.flush();
  const snapshot = proposalSnapshot.parse(v.snapshot);
  return { bytes, fileName: pdfFileName(snapshot.customer.name, v.number), sha256 };
}
