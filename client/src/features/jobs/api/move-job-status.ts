import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { JobRecord, JobStatus } from '@contract';
import { useJobEdits } from '../../../entities/job/job-edits';
import { jobKeys } from '../../../entities/job/query-keys';
import { updateJob } from '../../../entities/job/requests';
import { ApiError, isApiError } from '../../../lib/api-error';

/**
 * A status move goes straight away (a button the person waits on), but must not overtake an edit
 * still in the device's queue (it would then meet a newer version): wait for the queue, then send
 * with the newest version this tab holds. A 409 loads their version and says so.
 */
export function useMoveJobStatus(jobId: string) {
  const queryClient = useQueryClient();
  const edits = useJobEdits();
  return useMutation({
    mutationFn: async ({ job, to, lostReason }: { job: JobRecord; to: JobStatus; lostReason?: string }) => {
      await edits.flush();
      const held = queryClient.getQueryData<JobRecord>(jobKeys.detail(jobId)) ?? job;
      try {
        return await updateJob(
          jobId,
          held.version,
          lostReason === undefined ? { status: to } : { status: to, lostReason },
        );
      } catch (e) {
        if (isApiError(e) && e.status === 409) {
          await queryClient.invalidateQueries({ queryKey: jobKeys.detail(jobId), exact: true });
          throw new ApiError({
            ...e,
            detail:
              'Someone else saved this job meanwhile. Their version is loaded now: check the fields and save again.',
            errors: [],
          });
        }
        throw e;
      }
    },
    onSuccess: async (saved) => {
      queryClient.setQueryData(jobKeys.detail(jobId), saved);
      await queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
    },
  });
}
