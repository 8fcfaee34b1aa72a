import { queryOptions, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { DatasetId } from '@calc';
import { apiFetch } from '../../../lib/api-client';
import { priceBookKeys } from '../query-keys';
import { companyDataTableResponse as tableResponse } from '@contract';
import { nothingHeldOffline, useOnline } from '../../../lib/offline/online';

export const tablePath = (dataset: DatasetId) => `/api/company-data/${dataset}`;

export async function getTable(dataset: DatasetId, signal?: AbortSignal) {
  return (await apiFetch(tablePath(dataset), { schema: tableResponse, signal })).rows;
}

export const tableQueryOptions = (dataset: DatasetId) =>
  queryOptions({ queryKey: priceBookKeys.table(dataset), queryFn: ({ signal }) => getTable(dataset, signal) });

export function useTable(dataset: DatasetId) {
  const online = useOnline();
  const queryClient = useQueryClient();
  const options = tableQueryOptions(dataset);
  // A table this phone never saved cannot load with no signal: say so (the panel's boundary shows it) instead of
  // suspending until the connection is back.
  if (!online && queryClient.getQueryData(options.queryKey) === undefined) throw nothingHeldOffline();
  return useSuspenseQuery(options).data;
}
