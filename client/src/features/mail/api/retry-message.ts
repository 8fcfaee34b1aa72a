import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { mailKeys } from '../query-keys';
import { mailMessageResponse } from '@contract';

export async function retryMessage(id: string) {
  return (await apiFetch(`/api/mail/${encodeURIComponent(id)}/retry`, { method: 'POST', schema: mailMessageResponse }))
    .message;
}

export function useRetryMessage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retryMessage,
    onSettled: () => queryClient.invalidateQueries({ queryKey: mailKeys.all }),
  });
}
