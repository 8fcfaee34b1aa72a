import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { jobKeys, type JobListFilters } from '../../../entities/job/query-keys';
import { jobsResponse } from '@contract';

/** GET /api/jobs?search&status&page&pageSize — sorted by last activity on the server. */
export async function getJobs(filters: JobListFilters, signal?: AbortSignal) {
  const q = new URLSearchParams({ page: String(filters.page), pageSize: String(filters.pageSize) });
  if (filters.search) q.set('search', filters.search);
  if (filters.status) q.set('status', filters.status);
  return apiFetch(`/api/jobs?${q.toString()}`, { schema: jobsResponse, signal });
}

export const jobsQueryOptions = (filters: JobListFilters) =>
  queryOptions({
    queryKey: jobKeys.list(filters),
    queryFn: ({ signal }) => getJobs(filters, signal),
    placeholderData: keepPreviousData,
  });

export function useJobs(filters: JobListFilters) {
  return useQuery(jobsQueryOptions(filters));
}
