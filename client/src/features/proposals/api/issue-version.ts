import { useMutation, useQueryClient } from '@tanstack/react-query';
import { proposalResponse } from '@contract';
import { jobKeys } from '../../../entities/job/query-keys';
import { apiFetch } from '../../../lib/api-client';
import { proposalKeys } from '../query-keys';
import { proposalPath } from './get-proposal';

/**
 * POST /api/jobs/:jobId/proposal/versions — the server works the options out again and freezes version N+1.
 * A 409 says why the job cannot be issued (not marked ready, what blocks it). The job record changes too
 * (it now has a proposal), so it and the lists are asked for again.
 */
export function useIssueVersion(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch(`${proposalPath(jobId)}/versions`, { method: 'POST', schema: proposalResponse }),
    onSuccess: async (proposal) => {
      queryClient.setQueryData(proposalKeys.proposal(jobId), proposal);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: jobKeys.detail(jobId), exact: true }),
        // What hangs under the proposal (the send panel's links: which version may be sent) is asked for again.
        queryClient.invalidateQueries({
          queryKey: proposalKeys.proposal(jobId),
          predicate: (q) => q.queryKey.length > proposalKeys.proposal(jobId).length,
        }),
        queryClient.invalidateQueries({ queryKey: jobKeys.lists() }),
      ]);
    },
  });
}
