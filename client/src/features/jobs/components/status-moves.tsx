import { useId, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { jobFacts, movesFor, type JobRecord, type JobStatus } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Spinner } from '../../../components/ui/spinner';
import { jobStatusText, moveLabels } from '../../../entities/job/labels';
import { errorMessage } from '../../../lib/api-error';
import type { Viewer } from '../../../lib/viewer';
import { lossReasonsQueryOptions } from '../../../entities/job/queries';
import { useMoveJobStatus } from '../api/move-job-status';

/**
 * Where the job stands, with the moves the contract lets this person make (the server checks the same
 * machine, with the job's own facts: "proposed" only once a proposal was issued). Marking a job lost asks
 * why, from the company's list of reasons, before anything is sent.
 */
export function StatusMoves({ job, viewer }: { job: JobRecord; viewer: Viewer }) {
  const move = useMoveJobStatus(job.id);
  const [askingWhy, setAskingWhy] = useState(false);
  const moves = movesFor(viewer.role, job.status, jobFacts(job));
  if (moves.length === 0) return null;
  const busy = move.isPending ? move.variables.to : null;
  const send = (to: JobStatus, lostReason?: string) =>
    move.mutate({ job, to, lostReason }, { onSuccess: () => setAskingWhy(false) });
  return (
    <div role="group" aria-labelledby={`moves-${job.id}`} className="flex flex-col gap-2">
      <p id={`moves-${job.id}`} className="text-base font-semibold text-ink-900">
        Status: {jobStatusText(job)}
      </p>
      {askingWhy ? (
        <LostReasonPicker
          busy={busy === 'lost'}
          onCancel={() => {
            setAskingWhy(false);
            move.reset();
          }}
          onChoose={(reason) => send('lost', reason)}
        />
      ) : (
        <div className="flex flex-wrap gap-2">
          {moves.map((to) => (
            <Button
              key={to}
              variant={to === 'lost' ? 'ghost' : 'secondary'}
              busy={busy === to}
              disabled={busy !== null}
              onClick={() => (to === 'lost' ? setAskingWhy(true) : send(to))}
            >
              {moveLabels[to]}
            </Button>
          ))}
        </div>
      )}
      {move.isError ? (
        <Alert tone="danger" title="The status was not changed.">
          {errorMessage(move.error)}
        </Alert>
      ) : null}
    </div>
  );
}

/** The company's loss reasons as large radio rows (a gloved thumb), then "Mark lost" or "Keep the job open". */
function LostReasonPicker({
  busy,
  onChoose,
  onCancel,
}: {
  busy: boolean;
  onChoose: (reason: string) => void;
  onCancel: () => void;
}) {
  // Always asked afresh when the picker opens, and the cached list is not offered while that answer is on its way:
  // a list kept from an earlier visit (the saved cache) could still carry a reason the owner has since renamed. With no
  // signal (the fetch paused) the kept list is what there is.
  const reasons = useQuery({ ...lossReasonsQueryOptions(), refetchOnMount: 'always' });
  const [chosen, setChosen] = useState<string | null>(null);
  const [missing, setMissing] = useState(false);
  const name = useId();
  if (reasons.isError)
    return (
      <Alert tone="danger" title="Could not load the reasons a job is lost.">
        {errorMessage(reasons.error)}
      </Alert>
    );
  if (!reasons.data || (reasons.fetchStatus === 'fetching' && !reasons.isFetchedAfterMount))
    return <Spinner label="Loading the reasons…" />;
  return (
    <form
      className="flex flex-col gap-3 rounded-md border border-line p-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (chosen === null) setMissing(true);
        else onChoose(chosen);
      }}
    >
      <fieldset aria-describedby={missing ? `${name}-missing` : undefined}>
        <legend className="text-base font-semibold text-ink-900">Why was the job lost?</legend>
        <div className="mt-2 flex flex-col gap-1">
          {reasons.data.reasons.map((r) => (
            <label
              key={r}
              className="flex min-h-touch cursor-pointer items-center gap-3 rounded-md px-2 hover:bg-ink-50"
            >
              <input
                type="radio"
                name={name}
                value={r}
                checked={chosen === r}
                onChange={() => {
                  setChosen(r);
                  setMissing(false);
                }}
                className="h-5 w-5"
              />
              <span className="text-base text-ink-950">{r}</span>
            </label>
          ))}
        </div>
      </fieldset>
      {missing ? (
        <p id={`${name}-missing`} className="text-sm font-semibold text-danger">
          Choose a reason first.
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" busy={busy}>
          Mark lost
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={busy}>
          Keep the job open
        </Button>
      </div>
    </form>
  );
}
