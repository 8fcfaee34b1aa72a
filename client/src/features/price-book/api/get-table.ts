import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { DatasetId } from '@calc';
import { apiFetch } from '../../../lib/api-client';
import { priceBookKeys } from '../query-keys';
import { companyDataTableResponse as tableResponse } from '@contract';

export const tablePath = (dataset: DatasetId) => `/api/company-data/${dataset}`;

export async function getTable(dataset: DatasetId, signal?: AbortSignal) {
  return (await apiFetch(tablePath(dataset), { schema: tableResponse, signal })).rows;
}

export const tableQueryOptions = (dataset: DatasetId) =>
  queryOptions({ queryKey: priceBookKeys.table(dataset), queryFn: ({ signal }) => getTable(dataset, signal) });

export function useTable(dataset: DatasetId) {
  return useSuspenseQuery(tableQueryOptions(dataset)).data;
}
