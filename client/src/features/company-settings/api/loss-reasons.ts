import { useMutation, useQueryClient } from '@tanstack/react-query';
import { lossReasonsResponse, type LossReasonsRecord } from '@contract';
import { LOSS_REASONS_PATH } from '../../../entities/job/paths';
import { jobKeys } from '../../../entities/job/query-keys';
import { apiFetch } from '../../../lib/api-client';

/**
 * PUT the whole list with If-Match (the owner's; "0" before the first save). The answer replaces the cached
 * list, so the job's "Mark lost" offers the new words at once.
 */
export function useSaveLossReasons() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ reasons, version }: { reasons: string[]; version: number }): Promise<LossReasonsRecord> =>
      (await apiFetch(LOSS_REASONS_PATH, { method: 'PUT', body: { reasons }, version, schema: lossReasonsResponse }))
        .lossReasons,
    onSuccess: (list) => queryClient.setQueryData(jobKeys.lossReasons(), list),
  });
}
