import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OptionRecord } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { optionPath } from './get-desk';
import { landOption } from './write-option';

/** DELETE an option (If-Match). */
export function useDeleteOption(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (option: Pick<OptionRecord, 'id' | 'version'>) => {
      await apiFetch(optionPath(jobId, option.id), { method: 'DELETE', version: option.version });
      return option.id;
    },
    onSuccess: (id) => landOption(queryClient, jobId, null, id),
  });
}
