import { z } from 'zod';
import type { JobListFilters } from '../../../entities/job/query-keys';
import { JOB_STATUSES, listQueryFields } from '@contract';

export const JOBS_PAGE_SIZE = 25;

const searchParamsSchema = z.object({
  q: listQueryFields.search.catch(''),
  status: z.union([z.enum(JOB_STATUSES), z.literal('')]).catch(''),
  page: listQueryFields.page.catch(1),
});

/** The list's filters live in the URL (?q=&status=&page=) so a reload or a shared link keeps them; a value the
 * server's list rules (the contract's) would refuse falls back to none / page 1 instead. */
export function filtersFromSearch(params: URLSearchParams): JobListFilters {
  const p = searchParamsSchema.parse({
    q: params.get('q') ?? '',
    status: params.get('status') ?? '',
    page: params.get('page') ?? '1',
  });
  return { search: p.q ?? '', status: p.status, page: p.page, pageSize: JOBS_PAGE_SIZE };
}
