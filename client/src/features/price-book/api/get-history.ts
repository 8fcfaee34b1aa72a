import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DatasetId } from '@calc';
import { apiFetch } from '../../../lib/api-client';
import { priceBookKeys } from '../query-keys';
import { companyDataHistoryResponse as historyResponse } from '@contract';
import { tablePath } from './get-table';

export const historyQueryOptions = (dataset: DatasetId, key: string) =>
  queryOptions({
    queryKey: priceBookKeys.history(dataset, key),
    queryFn: async ({ signal }) =>
      (
        await apiFetch(`${tablePath(dataset)}/${encodeURIComponent(key)}/history`, {
          schema: historyResponse,
          signal,
        })
      ).history,
  });

export function useHistory(dataset: DatasetId, key: string, enabled: boolean) {
  return useQuery({ ...historyQueryOptions(dataset, key), enabled });
}
