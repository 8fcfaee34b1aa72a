import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { apiFetch } from '../../../lib/api-client';

const endedResponse = z.object({ ended: z.number().int() });

/** Signs a person out on every device (for yourself: every device but this one). */
export function useEndSessions() {
  return useMutation({
    mutationFn: async (id: string) =>
      (
        await apiFetch(`/api/users/${encodeURIComponent(id)}/end-sessions`, {
          method: 'POST',
          schema: endedResponse,
        })
      ).ended,
  });
}
