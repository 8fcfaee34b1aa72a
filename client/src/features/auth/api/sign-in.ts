import type { QueryClient } from '@tanstack/react-query';
import { apiFetch, clearCsrfToken } from '../../../lib/api-client';
import type { FieldError } from '../../../lib/api-error';
import { userResponse } from '@contract';
import { signInSchema, type SignInInput } from '../schemas';
import { meQueryOptions } from './get-me';

/**
 * Sign-in's checks and request. The sign-in page loads this module when the form is first shown
 * (after it paints) rather than with the page: it brings zod and the contract, which a phone
 * would otherwise download before it can show two fields (issue 11's sign-in budget).
 */

/** The contract's sign-in rules (the server's own), as field errors; none when the values may be sent. */
export function checkSignIn(values: SignInInput): FieldError[] {
  const parsed = signInSchema.safeParse(values);
  if (parsed.success) return [];
  return parsed.error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
}

export async function signIn(queryClient: QueryClient, input: SignInInput) {
  const res = await apiFetch('/api/auth/login', { method: 'POST', body: input, schema: userResponse });
  // The server regenerates the session at sign-in, so the old token is void.
  clearCsrfToken();
  queryClient.removeQueries();
  await queryClient.fetchQuery(meQueryOptions());
  return res.user;
}
