import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { signingState, type ConsentBody, type SignatureBody, type SigningState } from '@contract';
import { apiFetch } from '../../../lib/api-client';

const base = (proposalId: string) => `/api/proposals/${encodeURIComponent(proposalId)}`;

/** The signed copy's download (the server sends it as an attachment). */
export const signedPdfHref = (proposalId: string) => `${base(proposalId)}/signed-pdf`;
/** The proposal's PDF, to open before agreeing (the sending slice's route). */
export const proposalPdfHref = (proposalId: string) => `${base(proposalId)}/pdf`;

export const signingKeys = {
  state: (proposalId: string) => ['customer-proposal', proposalId, 'signing'] as const,
};

/** GET /api/proposals/:id/signing, as the signing steps and the page around them read it (one cache entry). */
const signingQuery = (proposalId: string, chosenPosition: number | null) =>
  queryOptions({
    queryKey: [...signingKeys.state(proposalId), chosenPosition],
    queryFn: ({ signal }) => apiFetch(`${base(proposalId)}/signing`, { schema: signingState, signal }),
    meta: { persist: false },
  });

/**
 * GET /api/proposals/:id/signing. Never kept on the device (a shared browser). While the signed copy is
 * being made, asks again every few seconds until it is ready.
 */
export function useSigningState(proposalId: string, chosenPosition: number | null) {
  return useQuery({
    ...signingQuery(proposalId, chosenPosition),
    placeholderData: keepPreviousData,
    refetchInterval: (q) => (q.state.data?.signedPdf === 'waiting' ? 3000 : false),
  });
}

/**
 * Whether the proposal is signed, for the page around the steps: once it is, the options can no longer be
 * changed (the server refuses a new choice), so the page stops offering one. False until an option is chosen.
 */
export function useIsSigned(proposalId: string, chosenPosition: number | null): boolean {
  const query = useQuery({ ...signingQuery(proposalId, chosenPosition), enabled: chosenPosition !== null });
  return query.data?.signature != null;
}

function useSigningWrite<B>(proposalId: string, path: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: B) => apiFetch(`${base(proposalId)}${path}`, { method: 'POST', body, schema: signingState }),
    onSuccess: (state: SigningState) => {
      queryClient.setQueriesData({ queryKey: signingKeys.state(proposalId) }, state);
      return queryClient.invalidateQueries({ queryKey: ['customer-proposal', proposalId] });
    },
  });
}

/** POST …/consent: the customer agrees to sign electronically (ESIGN §7001(c)). */
export const useGiveConsent = (proposalId: string) => useSigningWrite<ConsentBody>(proposalId, '/consent');
/** POST …/signature. */
export const useSign = (proposalId: string) => useSigningWrite<SignatureBody>(proposalId, '/signature');
