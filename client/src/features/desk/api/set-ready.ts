import { useMutation, useQueryClient } from '@tanstack/react-query';
import { deskResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { deskKeys } from '../query-keys';
import { jobPath } from '../../../entities/job/paths';

/**
 * POST (mark) or DELETE (unmark) /api/jobs/:jobId/ready; a 422 carries every reason it cannot be marked.
 * `{ reason }` marks it with units outside their sizing range, giving the office's reason.
 */
export function useSetReady(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (ready: boolean | { reason: string }) =>
      apiFetch(`${jobPath(jobId)}/ready`, {
        method: ready === false ? 'DELETE' : 'POST',
        ...(typeof ready === 'object' ? { body: { sizingOverride: { reason: ready.reason } } } : {}),
        schema: deskResponse,
      }),
    onSuccess: (desk) => queryClient.setQueryData(deskKeys.desk(jobId), desk),
    onSettled: () => queryClient.invalidateQueries({ queryKey: deskKeys.desk(jobId) }),
  });
}
