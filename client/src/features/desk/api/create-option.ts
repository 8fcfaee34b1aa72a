import { useMutation, useQueryClient } from '@tanstack/react-query';
import { optionResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { optionsPath } from './get-desk';
import { landOption } from './write-option';

/** POST /api/jobs/:jobId/options — a new option, empty or a copy of another (at most three; the server says so). */
export function useCreateOption(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (body: { name: string; copyFromOptionId?: string }) =>
      (await apiFetch(optionsPath(jobId), { method: 'POST', body, schema: optionResponse })).option,
    onSuccess: (option) => landOption(queryClient, jobId, option),
  });
}
