import { z } from 'zod';
import type { JobListFilters } from '../../../entities/job/query-keys';
import { JOB_STATUSES } from '@contract';

export const JOBS_PAGE_SIZE = 25;

const searchParamsSchema = z.object({
  q: z.string().max(100).catch(''),
  status: z.union([z.enum(JOB_STATUSES), z.literal('')]).catch(''),
  page: z.coerce.number().int().min(1).max(100_000).catch(1),
});

/** The list's filters live in the URL (?q=&status=&page=) so a reload or a shared link keeps them. */
export function filtersFromSearch(params: URLSearchParams): JobListFilters {
  const p = searchParamsSchema.parse({
    q: params.get('q') ?? '',
    status: params.get('status') ?? '',
    page: params.get('page') ?? '1',
  });
  return { search: p.q.trim(), status: p.status, page: p.page, pageSize: JOBS_PAGE_SIZE };
}
