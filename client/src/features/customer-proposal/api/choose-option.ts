import { useMutation, useQueryClient } from '@tanstack/react-query';
import { customerProposalView } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { customerProposalKeys } from '../query-keys';
import { customerProposalApiPath } from './get-customer-proposal';

/** POST /api/proposals/:proposalId/option: the customer's choice (again until signed); the answer is the page's record. */
export function useChooseOption(proposalId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (position: number) =>
      apiFetch(`${customerProposalApiPath(proposalId)}/option`, {
        method: 'POST',
        body: { position },
        schema: customerProposalView,
      }),
    onSuccess: (view) => queryClient.setQueryData(customerProposalKeys.detail(proposalId), view),
  });
}
