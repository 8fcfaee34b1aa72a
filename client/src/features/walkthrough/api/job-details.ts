import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { jobKeys, jobPath } from '../../../lib/job-queries';
import { customerResponse, jobResponse, staffResponse, type JobStatus } from '@contract';
import type { CustomerChanges } from '../sync/edits';

/** What the job details form changes on the job itself (the site, notes, who it belongs to, status). */
export interface JobDetailsChanges {
  readonly street?: string;
  readonly unit?: string;
  readonly city?: string;
  readonly region?: string;
  readonly postalCode?: string;
  readonly notes?: string;
  readonly salespersonId?: string;
  readonly assignedInstallerId?: string | null;
  readonly status?: JobStatus;
}

/** PATCH /api/jobs/:id straight away (not through the walk-through queue): a button the person waits on. */
export async function saveJobDetails(jobId: string, version: number, changes: JobDetailsChanges) {
  return (await apiFetch(jobPath(jobId), { method: 'PATCH', version, body: changes, schema: jobResponse })).job;
}

/** PATCH /api/customers/:id, If-Match: the version the person edited. */
export async function saveCustomer(
  customerId: string,
  version: number | null,
  changes: CustomerChanges,
  person?: string,
) {
  return (
    await apiFetch(`/api/customers/${encodeURIComponent(customerId)}`, {
      method: 'PATCH',
      version,
      body: changes,
      person,
      schema: customerResponse,
    })
  ).customer;
}

export async function getCustomer(customerId: string, signal?: AbortSignal) {
  return (await apiFetch(`/api/customers/${encodeURIComponent(customerId)}`, { schema: customerResponse, signal }))
    .customer;
}

export const customerQueryOptions = (customerId: string) =>
  queryOptions({
    queryKey: [...jobKeys.all, 'customer', customerId] as const,
    queryFn: ({ signal }) => getCustomer(customerId, signal),
  });

export function useCustomer(customerId: string, enabled: boolean) {
  return useQuery({ ...customerQueryOptions(customerId), enabled });
}

/** GET /api/staff — owner and estimator only; the people a job can be handed to. */
export function useStaff(enabled: boolean) {
  return useQuery({
    queryKey: ['staff'] as const,
    queryFn: async ({ signal }) => (await apiFetch('/api/staff', { schema: staffResponse, signal })).staff,
    staleTime: 5 * 60_000,
    enabled,
  });
}
