import type { EntityManager } from '@mikro-orm/postgresql';
import {
  LINK_ENDED,
  PROPOSAL_LINK_SESSION_HOURS,
  proposalSnapshot,
  type LinkEndedReason,
  type ProposalSnapshot,
} from '@contract';
import { LinkEndedError } from '../../lib/errors';
import type { LinkGrant } from '../../lib/route';
import type { Clock } from '../../services/services';
import { ProposalEventSchema } from '../proposals/proposal.entity';
import { ProposalLinkSchema, type ProposalLink } from './proposal-link.entity';
import { sha256Hex } from './proposal-link.service';

/**
 * Opening a proposal link (the exchange) and checking, on every customer request, that the link a session
 * came through still works. A token is 43 base64url characters; anything else is as unknown as a token that
 * never existed, and both get the same answer with nothing about any company.
 */

const TOKEN = /^[A-Za-z0-9_-]{43}$/;

export interface LinkContact {
  name: string;
  phone: string | null;
  email: string | null;
}

export type OpenOutcome =
  { ok: true; grant: LinkGrant } | { ok: false; reason: LinkEndedReason | null; contact: LinkContact | null };

export const contactOf = (s: ProposalSnapshot): LinkContact => ({
  name: s.company.name,
  phone: s.company.phone,
  email: s.company.email,
});

/** Why a real link no longer works, or null while it does. */
export function endedReason(link: ProposalLink, now: Date): LinkEndedReason | null {
  if (link.revokedAt) return 'revoked';
  if (link.version.supersededAt) return 'superseded';
  if (link.expiresAt.getTime() <= now.getTime()) return 'expired';
  return null;
}

/**
 * Looks the token's SHA-256 up. A live link gives a grant for its proposal (until the link expires, and
 * for at most PROPOSAL_LINK_SESSION_HOURS) and writes 'opened' on the trail with the browser's address and
 * user agent; an ended one says why and whom to contact; an unknown or malformed token says nothing more.
 */
export async function openLink(
  em: EntityManager,
  clock: Clock,
  token: string,
  meta: { ip: string | null; userAgent: string | null },
): Promise<OpenOutcome> {
  if (!TOKEN.test(token)) return { ok: false, reason: null, contact: null };
  const link = await em.findOne(ProposalLinkSchema, { tokenSha256: sha256Hex(token) }, { populate: ['version'] });
  if (!link) return { ok: false, reason: null, contact: null };
  const now = clock.now();
  const reason = endedReason(link, now);
  if (reason) return { ok: false, reason, contact: contactOf(proposalSnapshot.parse(link.version.snapshot)) };
  em.create(ProposalEventSchema, {
    company: link.company,
    proposal: link.proposal,
    version: link.version,
    kind: 'opened',
    at: now,
    byUser: null,
    byCustomer: true,
    ip: meta.ip?.slice(0, 45) ?? null,
    userAgent: meta.userAgent?.slice(0, 400) ?? null,
    data: { linkId: link.id },
  });
  await em.flush();
  const expiresAt = Math.min(link.expiresAt.getTime(), now.getTime() + PROPOSAL_LINK_SESSION_HOURS * 3_600_000);
  return {
    ok: true,
    grant: {
      proposalId: link.proposal.id,
      companyId: link.company.id,
      expiresAt,
      linkId: link.id,
      versionId: link.version.id,
    },
  };
}

/** The words for an ended link: why (when the link was real) and the "no longer works" lead. */
export function endedDetail(reason: LinkEndedReason | null): string {
  return reason ? LINK_ENDED[reason] : LINK_ENDED.unknown;
}

/**
 * The link a customer's session came through, checked again on each request: revoking a link or issuing
 * a new version ends the sessions it opened too (410 with why and whom to contact).
 */
export async function liveLink(em: EntityManager, clock: Clock, grant: LinkGrant): Promise<ProposalLink> {
  const link = grant.linkId
    ? await em.findOne(
        ProposalLinkSchema,
        { id: grant.linkId, company: grant.companyId, proposal: grant.proposalId },
        { populate: ['version'] },
      )
    : null;
  if (!link) throw new LinkEndedError(LINK_ENDED.unknown, { reason: null, contact: null });
  const reason = endedReason(link, clock.now());
  if (reason)
    throw new LinkEndedError(endedDetail(reason), {
      reason,
      contact: contactOf(proposalSnapshot.parse(link.version.snapshot)),
    });
  return link;
}

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

/**
 * The page an ended or unknown link shows: plain HTML made on the server (no script), phone first. For a
 * token that never existed (or was altered) the page is the same bytes whatever was sent.
 */
export function linkEndedPage(reason: LinkEndedReason | null, contact: LinkContact | null): string {
  return page(LINK_ENDED.title, endedDetail(reason), contact);
}

/** The answer while an address that failed too often waits (the same for every token). */
export const tooManyTriesPage = () => page(LINK_ENDED.tooManyTitle, LINK_ENDED.tooMany, null);

function page(title: string, detail: string, contact: LinkContact | null): string {
  const why = escapeHtml(detail);
  const reach = contact
    ? `<p>${escapeHtml(LINK_ENDED.contact)} <strong>${escapeHtml(contact.name)}</strong>${
        contact.phone
          ? ` at <a href="tel:${escapeHtml(contact.phone.replace(/[^0-9+]/g, ''))}">${escapeHtml(contact.phone)}</a>`
          : ''
      }${contact.email ? `${contact.phone ? ' or' : ' at'} <a href="mailto:${escapeHtml(contact.email)}">${escapeHtml(contact.email)}</a>` : ''}.</p>`
    : '';
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="referrer" content="no-referrer">
<title>${escapeHtml(title)}</title>
<style>
body{margin:0;font-family:"Source Sans 3",ui-sans-serif,system-ui,sans-serif;background:#fbfaf7;color:#0b2227;line-height:1.5}
main{max-width:32rem;margin:0 auto;padding:2.5rem 1rem}
.card{background:#fff;border-radius:.875rem;padding:1.5rem;box-shadow:0 1px 2px rgb(18 52 59/.08),0 2px 8px rgb(18 52 59/.06)}
h1{font-size:1.728rem;line-height:1.25;font-weight:600;color:#12343b;margin:0 0 .75rem}
p{font-size:1.2rem;margin:0 0 .75rem}
a{color:#18383e;font-weight:600}
</style>
</head>
<body>
<main>
<div class="card">
<h1>${escapeHtml(title)}</h1>
<p>${why}</p>
${reach}
</div>
</main>
</body>
</html>
`;
}
