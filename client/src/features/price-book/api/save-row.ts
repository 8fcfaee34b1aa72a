import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DatasetId } from '@calc';
import { apiFetch } from '../../../lib/api-client';
import { priceBookKeys } from '../query-keys';
import { companyDataRowResponse as rowResponse } from '@contract';
import { tablePath } from './get-table';

export interface SaveRowInput {
  dataset: DatasetId;
  record: Record<string, unknown>;
  /** The version edited; absent for a new record. */
  version?: number;
  key?: string;
}

export async function saveRow({ dataset, record, version, key }: SaveRowInput) {
  const res =
    key === undefined
      ? await apiFetch(tablePath(dataset), { method: 'POST', body: { record }, schema: rowResponse })
      : await apiFetch(`${tablePath(dataset)}/${encodeURIComponent(key)}`, {
          method: 'PUT',
          body: { record },
          version: version ?? null,
          schema: rowResponse,
        });
  return res.row;
}

export function useSaveRow() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveRow,
    onSuccess: (_row, input) => queryClient.invalidateQueries({ queryKey: priceBookKeys.all }).then(() => input),
  });
}
