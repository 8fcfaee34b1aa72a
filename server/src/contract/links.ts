/**
 * Client addresses the server also writes (in e-mails). Kept apart from accounts.ts, which holds
 * zod schemas: the client's router uses these in the first chunk every page loads (issue 11).
 */

/** The client page a reset e-mail links to; the token follows in the fragment (`#token=…`). */
export const RESET_PASSWORD_PATH = '/reset-password';
