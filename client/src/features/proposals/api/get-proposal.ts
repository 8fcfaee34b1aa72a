import { queryOptions } from '@tanstack/react-query';
import { proposalResponse, type ProposalResponse } from '@contract';
import { jobPath } from '../../../entities/job/paths';
import { apiFetch } from '../../../lib/api-client';
import { proposalKeys } from '../query-keys';

export const proposalPath = (jobId: string) => `${jobPath(jobId)}/proposal`;
export const versionPath = (jobId: string, n: number) => `${proposalPath(jobId)}/versions/${n}`;
/** The PDF route (office): shown in the page's frame, or `download` for an attachment. */
export const pdfPath = (jobId: string, n: number, download = false) =>
  `${versionPath(jobId, n)}/pdf${download ? '?download=1' : ''}`;

/** The sealed signed copy of a signed version (office), as an attachment. */
export const signedPdfPath = (jobId: string, n: number) => `${versionPath(jobId, n)}/signed-pdf`;

/** How often the screen asks again while a version's PDF is waiting or being made. */
export const PDF_POLL_MS = 2000;

/** Whether some version's PDF, or a signed version's sealed copy, is still on its way (the screen then polls). */
export const pdfPending = (data: ProposalResponse | undefined): boolean =>
  data?.proposal?.versions.some(
    (v) =>
      v.pdf.state === 'waiting' || v.pdf.state === 'rendering' || (v.signed != null && v.signed.copySha256 === null),
  ) ?? false;

/**
 * GET /api/jobs/:jobId/proposal — the versions (newest first), the audit trail in order and whether a version
 * may be issued. While a PDF is waiting or rendering it asks again every two seconds, and stops once none is.
 */
export const proposalQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: proposalKeys.proposal(jobId),
    queryFn: ({ signal }) => apiFetch(proposalPath(jobId), { schema: proposalResponse, signal }),
    staleTime: 0,
    refetchOnWindowFocus: true,
    refetchInterval: (query) => (pdfPending(query.state.data) ? PDF_POLL_MS : false),
  });
