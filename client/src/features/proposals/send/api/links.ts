import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { proposalLinksResponse, type ProposalLinksResponse } from '@contract';
import { jobPath } from '../../../../entities/job/paths';
import { jobKeys } from '../../../../entities/job/query-keys';
import { apiFetch } from '../../../../lib/api-client';
import { proposalLinkKeys } from '../query-keys';

const linksPath = (jobId: string) => `${jobPath(jobId)}/proposal/links`;

/** While an e-mail waits for the mail server, the list is read again every few seconds until it has gone. */
const WAITING_POLL_MS = 4000;

/** GET /api/jobs/:jobId/proposal/links: the links with their mail state, and whether the current version may be sent. */
export const proposalLinksQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: proposalLinkKeys.links(jobId),
    queryFn: ({ signal }) => apiFetch(linksPath(jobId), { schema: proposalLinksResponse, signal }),
    refetchInterval: (query) =>
      query.state.data?.links.some((l) => l.state === 'waiting-to-send') ? WAITING_POLL_MS : false,
  });

/** After a send or a withdrawal: the links (from the answer), the trail and the job's status read again. */
function useSettled(jobId: string) {
  const queryClient = useQueryClient();
  return async (links: ProposalLinksResponse) => {
    queryClient.setQueryData(proposalLinkKeys.links(jobId), links);
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: proposalLinkKeys.proposal(jobId), exact: true }),
      queryClient.invalidateQueries({ queryKey: jobKeys.detail(jobId), exact: true }),
      queryClient.invalidateQueries({ queryKey: jobKeys.lists() }),
    ]);
  };
}

/** POST …/proposal/links: send the current version to this address (a new link each time). */
export function useSendProposal(jobId: string) {
  const settled = useSettled(jobId);
  return useMutation({
    mutationFn: (to: string) =>
      apiFetch(linksPath(jobId), { method: 'POST', body: { to }, schema: proposalLinksResponse }),
    onSuccess: settled,
  });
}

/** POST …/proposal/links/:linkId/revoke: the link, and any page it opened, stops working. */
export function useRevokeLink(jobId: string) {
  const settled = useSettled(jobId);
  return useMutation({
    mutationFn: (linkId: string) =>
      apiFetch(`${linksPath(jobId)}/${encodeURIComponent(linkId)}/revoke`, {
        method: 'POST',
        schema: proposalLinksResponse,
      }),
    onSuccess: settled,
  });
}
