import { useMutation, useQueryClient } from '@tanstack/react-query';
import { optionResponse, type OptionPricingInput, type OptionRecord } from '@contract';
import type { DesignInput } from '@calc';
import { apiFetch } from '../../../lib/api-client';
import { optionPath } from './get-desk';
import { landOption } from './write-option';

export interface OptionChanges {
  readonly name?: string;
  readonly design?: DesignInput;
  readonly pricing?: OptionPricingInput;
}

/** PATCH an option's name, design or pricing (If-Match: the version on screen); the server recomputes every number. */
export function useUpdateOption(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ option, changes }: { option: Pick<OptionRecord, 'id' | 'version'>; changes: OptionChanges }) =>
      (
        await apiFetch(optionPath(jobId, option.id), {
          method: 'PATCH',
          version: option.version,
          body: changes,
          schema: optionResponse,
        })
      ).option,
    onSuccess: (option) => landOption(queryClient, jobId, option),
  });
}
