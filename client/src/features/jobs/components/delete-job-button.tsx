import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-error';
import { mayDeleteJob, type JobRecord } from '@contract';
import { useViewer } from '../../../lib/viewer';
import { useDeleteJob } from '../api/delete-job';

/** For a job made by mistake: asks, deletes it with its rooms and photos, and goes back to the jobs list. */
export function DeleteJobButton({ job }: { job: JobRecord }) {
  const viewer = useViewer();
  const remove = useDeleteJob();
  if (!viewer || !mayDeleteJob(viewer, job)) return null;

  const handleDelete = () => {
    const question = `Delete the job for ${job.customer.name} at ${job.site.street}? Its rooms and photos are deleted too; this cannot be undone. The customer stays.`;
    if (!window.confirm(question)) return;
    remove.mutate({ id: job.id, version: job.version });
  };

  return (
    <div className="flex flex-col items-start gap-2">
      <Button variant="danger" busy={remove.isPending} onClick={handleDelete}>
        Delete job
      </Button>
      {remove.isError ? (
        <Alert tone="danger" title="The job was not deleted">
          {errorMessage(remove.error)}
        </Alert>
      ) : null}
    </div>
  );
}
