import { CUSTOMER_PROPOSAL_PREFIX, RESET_PASSWORD_PATH } from '@contract';

/** Every client URL in one place; build links with these, never with string literals. */
export const paths = {
  home: '/',
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  resetPassword: RESET_PASSWORD_PATH,
  account: '/account',
  jobs: '/jobs',
  users: '/users',
  outbox: '/dev/outbox',
  mail: '/mail',
  reports: '/reports',
  priceBook: '/price-book',
  companySettings: '/settings',
  /** The customer's page of a proposal (no staff sign-in). */
  customerProposal: `${CUSTOMER_PROPOSAL_PREFIX}/:proposalId`,
} as const;

export type AppPath = (typeof paths)[keyof typeof paths];

export function signInPath(next?: string): string {
  return next && next !== paths.home ? `${paths.signIn}?next=${encodeURIComponent(next)}` : paths.signIn;
}

/** Accepts only same-origin relative paths ("/jobs?x=1"), never "//host" or "https://…". */
export function safeNext(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return paths.home;
  try {
    const url = new URL(next, 'http://gaugeline.invalid');
    if (url.origin !== 'http://gaugeline.invalid') return paths.home;
    if (url.pathname === paths.signIn) return paths.home;
    return `${url.pathname}${url.search}${url.hash}`;
  } catch {
    return paths.home;
  }
}
