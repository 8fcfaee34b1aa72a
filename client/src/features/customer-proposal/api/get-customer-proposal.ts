import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { customerProposalView } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { customerProposalKeys } from '../query-keys';

export const customerProposalApiPath = (proposalId: string) => `/api/proposals/${encodeURIComponent(proposalId)}`;

/**
 * GET /api/proposals/:proposalId: the version this browser's link sent (the customer view: no costs or
 * internal fields). Never kept on the device (`meta.persist: false`): the browser may be a shared one.
 */
export const customerProposalQueryOptions = (proposalId: string) =>
  queryOptions({
    queryKey: customerProposalKeys.detail(proposalId),
    queryFn: ({ signal }) => apiFetch(customerProposalApiPath(proposalId), { schema: customerProposalView, signal }),
    meta: { persist: false },
  });

export const useCustomerProposal = (proposalId: string) => useSuspenseQuery(customerProposalQueryOptions(proposalId));
