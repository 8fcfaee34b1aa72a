import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { JobRecord } from '@contract';
import { useJobEdits } from '../../../entities/job/job-edits';
import { jobPaths } from '../../../entities/job/paths';
import { jobKeys } from '../../../entities/job/query-keys';
import { deleteJob } from '../../../entities/job/requests';

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
  const edits = useJobEdits();
  return useMutation({
    mutationFn: (job: Pick<JobRecord, 'id' | 'version'>) => deleteJob(job.id, job.version),
    onSuccess: async (_answer, job) => {
      await edits.discardJob(job.id);
      await queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
      await navigate(jobPaths.list, { replace: true });
      queryClient.removeQueries({ queryKey: jobKeys.detail(job.id) });
    },
  });
}
