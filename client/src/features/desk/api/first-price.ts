import { useMutation, useQueryClient } from '@tanstack/react-query';
import { firstPriceResponse } from '@contract';
import { jobPath } from '../../../entities/job/paths';
import { apiFetch } from '../../../lib/api-client';
import { landOption } from './write-option';

/** POST /api/jobs/:jobId/first-price — one preliminary option filled from the catalog's suggestion, with its range. */
export function useFirstPrice(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () =>
      apiFetch(`${jobPath(jobId)}/first-price`, { method: 'POST', body: {}, schema: firstPriceResponse }),
    onSuccess: (answer) => landOption(queryClient, jobId, answer.option),
  });
}
