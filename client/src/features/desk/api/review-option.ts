import { useMutation, useQueryClient } from '@tanstack/react-query';
import { optionResponse, type OptionRecord } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { optionPath } from './get-desk';
import { landOption } from './write-option';

/** The office has reviewed a first price (If-Match): the option loses its preliminary mark and may be proposed. */
export function useReviewOption(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (option: Pick<OptionRecord, 'id' | 'version'>) =>
      (
        await apiFetch(`${optionPath(jobId, option.id)}/review`, {
          method: 'POST',
          version: option.version,
          schema: optionResponse,
        })
      ).option,
    onSuccess: (option) => landOption(queryClient, jobId, option),
  });
}
