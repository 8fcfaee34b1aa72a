import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { proposalDetailsResponse, type ProposalDetailsBody, type ProposalDetailsRecord } from '@contract';
import { apiFetch } from '../../../lib/api-client';

export const PROPOSAL_DETAILS_PATH = '/api/company/proposal-details';
const LOGO_PATH = `${PROPOSAL_DETAILS_PATH}/logo`;
/** The form field the server reads the file from (lib/receive-upload.ts). */
const FILE_FIELD = 'file';

export const proposalDetailsKey = () => ['company-proposal-details'] as const;

/** What every proposal carries: contact lines, licence, terms, warranty, extra cancellation wording, the logo. */
export const proposalDetailsQueryOptions = () =>
  queryOptions({
    queryKey: proposalDetailsKey(),
    queryFn: async ({ signal }) =>
      (await apiFetch(PROPOSAL_DETAILS_PATH, { schema: proposalDetailsResponse, signal })).details,
    staleTime: 5 * 60_000,
  });

/** Every answer carries the whole record: it replaces the cached one the settings screen reads. */
function useDetailsMutation<V>(request: (vars: V) => Promise<ProposalDetailsRecord | null>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: request,
    onSuccess: async (details) => {
      if (details) queryClient.setQueryData(proposalDetailsKey(), details);
      else await queryClient.invalidateQueries({ queryKey: proposalDetailsKey() });
    },
  });
}

/** PUT the whole document with If-Match (the owner's). */
export function useSaveProposalDetails() {
  return useDetailsMutation(
    async ({ body, version }: { body: ProposalDetailsBody; version: number }) =>
      (await apiFetch(PROPOSAL_DETAILS_PATH, { method: 'PUT', body, version, schema: proposalDetailsResponse }))
        .details,
  );
}

/** Upload a logo (the server checks and re-encodes it; a 415/413 says why it was refused). */
export function useUploadLogo() {
  return useDetailsMutation(async (file: File) => {
    const body = new FormData();
    body.append(FILE_FIELD, file);
    return (await apiFetch(LOGO_PATH, { method: 'POST', body, schema: proposalDetailsResponse })).details;
  });
}

/** Take the logo off future proposals (issued versions keep theirs). */
export function useRemoveLogo() {
  return useDetailsMutation(async () => {
    await apiFetch(LOGO_PATH, { method: 'DELETE' });
    return null;
  });
}
