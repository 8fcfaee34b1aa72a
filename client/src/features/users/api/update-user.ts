import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { userKeys } from '../query-keys';
import { userResponse } from '@contract';
import type { UpdateUserInput } from '../schemas';

export async function updateUser({ id, ...changes }: UpdateUserInput & { id: string }) {
  return (
    await apiFetch(`/api/users/${encodeURIComponent(id)}`, { method: 'PATCH', body: changes, schema: userResponse })
  ).user;
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
}
