import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DatasetId } from '@calc';
import { apiFetch } from '../../../lib/api-client';
import { priceBookKeys } from '../query-keys';
import { importApplyResponse as applyResponse, importPreviewResponse as previewResponse } from '@contract';
import { tablePath } from './get-table';

export async function previewImport({ dataset, csv }: { dataset: DatasetId; csv: string }) {
  return (
    await apiFetch(`${tablePath(dataset)}/import/preview`, { method: 'POST', body: { csv }, schema: previewResponse })
  ).preview;
}

export async function applyImport({ dataset, csv, token }: { dataset: DatasetId; csv: string; token: string }) {
  return (
    await apiFetch(`${tablePath(dataset)}/import/apply`, {
      method: 'POST',
      body: { csv, token },
      schema: applyResponse,
    })
  ).applied;
}

export const usePreviewImport = () => useMutation({ mutationFn: previewImport });

export function useApplyImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: applyImport,
    onSuccess: async (applied) => {
      await queryClient.invalidateQueries({ queryKey: priceBookKeys.all });
      return applied;
    },
  });
}
