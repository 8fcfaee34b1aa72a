import { useMutation, useQueryClient } from '@tanstack/react-query';
import { deskResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { deskKeys } from '../query-keys';
import { jobPath } from '../../../entities/job/paths';

/** POST (mark) or DELETE (unmark) /api/jobs/:jobId/ready; a 422 carries every reason it cannot be marked. */
export function useSetReady(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (ready: boolean) =>
      apiFetch(`${jobPath(jobId)}/ready`, { method: ready ? 'POST' : 'DELETE', schema: deskResponse }),
    onSuccess: (desk) => queryClient.setQueryData(deskKeys.desk(jobId), desk),
    onSettled: () => queryClient.invalidateQueries({ queryKey: deskKeys.desk(jobId) }),
  });
}
