import { useMutation, useQueryClient } from '@tanstack/react-query';
import { optionResponse, type OptionRecord } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { optionPath } from './get-desk';
import { landOption } from './write-option';

/** The owner approves or denies a discount beyond someone's limit (If-Match). */
export function useDecideDiscount(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ option, approve }: { option: Pick<OptionRecord, 'id' | 'version'>; approve: boolean }) =>
      (
        await apiFetch(`${optionPath(jobId, option.id)}/discount-decision`, {
          method: 'POST',
          version: option.version,
          body: { approve },
          schema: optionResponse,
        })
      ).option,
    onSuccess: (option) => landOption(queryClient, jobId, option),
  });
}
