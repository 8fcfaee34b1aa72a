import { queryOptions, useQuery } from '@tanstack/react-query';
import { loadsResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { jobKeys, jobPath } from '../../../lib/job-queries';

/** GET /api/jobs/:id/loads — the server's own recomputation from the saved inputs. */
export function getServerLoads(jobId: string, signal?: AbortSignal) {
  return apiFetch(`${jobPath(jobId)}/loads`, { schema: loadsResponse, signal });
}

export const serverLoadsQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: jobKeys.serverLoads(jobId),
    queryFn: ({ signal }) => getServerLoads(jobId, signal),
    retry: false,
  });

export function useServerLoads(jobId: string) {
  return useQuery(serverLoadsQueryOptions(jobId));
}
