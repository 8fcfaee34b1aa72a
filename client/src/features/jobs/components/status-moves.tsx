import { movesFor, NO_PROPOSAL_YET, type JobRecord } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { jobStatusLabels, moveLabels } from '../../../entities/job/labels';
import { errorMessage } from '../../../lib/api-error';
import type { Viewer } from '../../../lib/viewer';
import { useMoveJobStatus } from '../api/move-job-status';

/** Where the job stands, with the moves the contract lets this person make (the server checks the same machine). */
export function StatusMoves({ job, viewer }: { job: JobRecord; viewer: Viewer }) {
  const move = useMoveJobStatus(job.id);
  const moves = movesFor(viewer.role, job.status, NO_PROPOSAL_YET);
  if (moves.length === 0) return null;
  const busy = move.isPending ? move.variables.to : null;
  return (
    <div role="group" aria-labelledby={`moves-${job.id}`} className="flex flex-col gap-2">
      <p id={`moves-${job.id}`} className="text-base font-semibold text-ink-900">
        Status: {jobStatusLabels[job.status]}
      </p>
      <div className="flex flex-wrap gap-2">
        {moves.map((to) => (
          <Button
            key={to}
            variant={to === 'lost' ? 'ghost' : 'secondary'}
            busy={busy === to}
            disabled={busy !== null}
            onClick={() => move.mutate({ job, to })}
          >
            {moveLabels[to]}
          </Button>
        ))}
      </div>
      {move.isError ? (
        <Alert tone="danger" title="The status was not changed.">
          {errorMessage(move.error)}
        </Alert>
      ) : null}
    </div>
  );
}
