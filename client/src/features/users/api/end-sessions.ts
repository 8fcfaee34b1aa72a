import { useMutation } from '@tanstack/react-query';
import { sessionsEndedResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';

/** Signs a person out on every device (for yourself: every device but this one). */
export function useEndSessions() {
  return useMutation({
    mutationFn: async (id: string) =>
      (
        await apiFetch(`/api/users/${encodeURIComponent(id)}/end-sessions`, {
          method: 'POST',
          schema: sessionsEndedResponse,
        })
      ).ended,
  });
}
