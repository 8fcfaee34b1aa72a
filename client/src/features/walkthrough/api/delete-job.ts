import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { jobPaths } from '../../../lib/job-paths';
import { jobKeys, jobPath } from '../../../lib/job-queries';
import { apiFetch } from '../../../lib/api-client';
import type { JobRecord } from '@contract';
import { isApiError } from '../../../lib/api-error';
import { usePhotoQueue } from '../sync/photo-queue-context';
import { useWalkthroughQueue } from '../sync/queue-context';

/** DELETE /api/jobs/:jobId, If-Match: the version the person saw. Rooms and photos go with it. */
export async function deleteJob(jobId: string, version: number) {
  await apiFetch(jobPath(jobId), { method: 'DELETE', version }).catch((e: unknown) => {
    // Deleted already (on another device, or an answer lost on the way): what was asked is done.
    if (!(isApiError(e) && e.status === 404)) throw e;
  });
}

/**
 * Deletes the job, then leaves its screen. The job's queries are dropped only once the jobs list
 * is showing: dropped while the walk-through is still mounted (a data router waits for the next
 * page's loader first), any re-render there would fetch the deleted job again and show a 404.
 * The callbacks sit on the hook, not on mutate(), so they still run once this screen unmounts.
 * Edits and photos of the job still waiting on this device go too (the person was told so): left
 * in the queue they would replay into 404s, and a conflict about one would hold every later edit.
 */
export function useDeleteJob() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const edits = useWalkthroughQueue();
  const photos = usePhotoQueue();
  return useMutation({
    mutationFn: (job: Pick<JobRecord, 'id' | 'version'>) => deleteJob(job.id, job.version),
    onSuccess: async (_answer, job) => {
      await Promise.all([edits.discard((i) => i.payload.jobId === job.id), photos.discardJob(job.id)]);
      await queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
      await navigate(jobPaths.list, { replace: true });
      queryClient.removeQueries({ queryKey: jobKeys.detail(job.id) });
    },
  });
}
