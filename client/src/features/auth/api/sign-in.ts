import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch, clearCsrfToken } from '../../../lib/api-client';
import { userResponse } from '@contract';
import type { SignInInput } from '../schemas';
import { meQueryOptions } from './get-me';

export async function signIn(input: SignInInput) {
  const res = await apiFetch('/api/auth/login', { method: 'POST', body: input, schema: userResponse });
  // The server regenerates the session at sign-in, so the old token is void.
  clearCsrfToken();
  return res.user;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: async () => {
      queryClient.removeQueries();
      await queryClient.fetchQuery(meQueryOptions());
    },
  });
}
