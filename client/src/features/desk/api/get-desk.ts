import { queryOptions } from '@tanstack/react-query';
import { deskResponse } from '@contract';
import { jobPath } from '../../../entities/job/paths';
import { apiFetch } from '../../../lib/api-client';
import { deskKeys } from '../query-keys';

export const deskPath = (jobId: string) => `${jobPath(jobId)}/desk`;
export const optionsPath = (jobId: string) => `${jobPath(jobId)}/options`;
export const optionPath = (jobId: string, optionId: string) => `${optionsPath(jobId)}/${encodeURIComponent(optionId)}`;

/**
 * GET /api/jobs/:jobId/desk — every option recomputed by the server, and whether the job may be proposed.
 * Several people work one desk (the owner decides a discount the estimator asked for), so a visit or a
 * return to the window always asks the server again rather than trusting a copy from seconds ago.
 */
export const deskQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: deskKeys.desk(jobId),
    queryFn: ({ signal }) => apiFetch(deskPath(jobId), { schema: deskResponse, signal }),
    staleTime: 0,
    refetchOnWindowFocus: true,
  });
