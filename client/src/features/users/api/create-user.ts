import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { userKeys } from '../query-keys';
import { userResponse } from '@contract';
import type { CreateUserInput } from '../schemas';

export async function createUser(input: CreateUserInput) {
  return (await apiFetch('/api/users', { method: 'POST', body: input, schema: userResponse })).user;
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
}
