/**
 * The one key tree for the job records that the jobs, walk-through, loads and desk features share:
 * an edit in one invalidates the others' views. A feature's own reads hang their keys under
 * `jobKeys.detail(jobId)` so that dropping a job drops them too.
 */
export interface JobListFilters {
  readonly search: string;
  readonly status: string;
  readonly page: number;
  readonly pageSize: number;
}

export const jobKeys = {
  all: ['jobs'] as const,
  lists: () => [...jobKeys.all, 'list'] as const,
  list: (filters: JobListFilters) => [...jobKeys.lists(), filters] as const,
  detail: (jobId: string) => [...jobKeys.all, 'detail', jobId] as const,
  rooms: (jobId: string) => [...jobKeys.detail(jobId), 'rooms'] as const,
  serverLoads: (jobId: string) => [...jobKeys.detail(jobId), 'loads'] as const,
  customers: (search: string) => [...jobKeys.all, 'customers', search] as const,
  customer: (customerId: string) => [...jobKeys.all, 'customer', customerId] as const,
  staff: () => ['staff'] as const,
  settings: () => ['company-settings'] as const,
  lossReasons: () => ['company-loss-reasons'] as const,
};
