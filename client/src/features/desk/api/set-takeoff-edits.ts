import { useMutation, useQueryClient } from '@tanstack/react-query';
import { optionResponse, type OptionRecord, type TakeoffEditInput } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { optionPath } from './get-desk';
import { landOption } from './write-option';

/** PUT the option's takeoff edits (the whole list, If-Match); the server keeps the generated values beside them. */
export function useSetTakeoffEdits(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({
      option,
      edits,
    }: {
      option: Pick<OptionRecord, 'id' | 'version'>;
      edits: TakeoffEditInput[];
    }) =>
      (
        await apiFetch(`${optionPath(jobId, option.id)}/takeoff-edits`, {
          method: 'PUT',
          version: option.version,
          body: { edits },
          schema: optionResponse,
        })
      ).option,
    onSuccess: (option) => landOption(queryClient, jobId, option),
  });
}

/** After a design change: keep (accept) or drop the edits that no longer apply (If-Match). */
export function useRegenerateTakeoff(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({
      option,
      accept = [],
      drop = [],
    }: {
      option: Pick<OptionRecord, 'id' | 'version'>;
      accept?: string[];
      drop?: string[];
    }) =>
      (
        await apiFetch(`${optionPath(jobId, option.id)}/takeoff/regenerate`, {
          method: 'POST',
          version: option.version,
          body: { accept, drop },
          schema: optionResponse,
        })
      ).option,
    onSuccess: (option) => landOption(queryClient, jobId, option),
  });
}
