import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { jobKeys } from '../../../entities/job/query-keys';
import { customersResponse } from '@contract';

/** GET /api/customers?search — the first page of matches, for picking a customer. */
export async function getCustomers(search: string, signal?: AbortSignal) {
  const q = new URLSearchParams({ page: '1', pageSize: '20' });
  if (search) q.set('search', search);
  return (await apiFetch(`/api/customers?${q.toString()}`, { schema: customersResponse, signal })).items;
}

export const customersQueryOptions = (search: string) =>
  queryOptions({ queryKey: jobKeys.customers(search), queryFn: ({ signal }) => getCustomers(search, signal) });

export function useCustomers(search: string, enabled: boolean) {
  return useQuery({ ...customersQueryOptions(search), enabled });
}
