/**
 * Client addresses the server also writes (in e-mails). Kept apart from accounts.ts, which holds
 * zod schemas: the client's router uses these in the first chunk every page loads (issue 11).
 */

/** The client page a reset e-mail links to; the token follows in the fragment (`#token=…`). */
export const RESET_PASSWORD_PATH = '/reset-password';

/** The customer's page of a proposal (no staff sign-in): `/p/<proposal id>`, where a proposal link lands. */
export const CUSTOMER_PROPOSAL_PREFIX = '/p';
export const customerProposalPath = (proposalId: string) => `${CUSTOMER_PROPOSAL_PREFIX}/${proposalId}`;
/** The server route a proposal e-mail's link opens (the token is in `t`): it answers 303 to the page above. */
export const PROPOSAL_LINK_OPEN_PATH = '/api/links/open';
