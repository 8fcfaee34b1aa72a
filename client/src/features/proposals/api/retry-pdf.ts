import { useMutation, useQueryClient } from '@tanstack/react-query';
import { proposalResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { proposalKeys } from '../query-keys';
import { versionPath } from './get-proposal';

/** POST …/versions/:n/pdf/retry — a PDF that failed after the queue's last try is queued once more (office). */
export function useRetryPdf(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (n: number) =>
      apiFetch(`${versionPath(jobId, n)}/pdf/retry`, { method: 'POST', schema: proposalResponse }),
    onSuccess: (proposal) => queryClient.setQueryData(proposalKeys.proposal(jobId), proposal),
  });
}
