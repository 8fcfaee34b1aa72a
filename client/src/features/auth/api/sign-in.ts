import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiFetch, clearCsrfToken } from '../../../lib/api-client';
import { userSchema } from '../../../types/user';
import type { SignInInput } from '../schemas';
import { meQueryOptions } from './get-me';

const signInResponse = z.object({ user: userSchema });

export async function signIn(input: SignInInput) {
  const res = await apiFetch('/api/auth/login', { method: 'POST', body: input, schema: signInResponse });
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
