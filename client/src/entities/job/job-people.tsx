import type { JobRecord } from '@contract';

/** Who the job is with, as two entries of a description list (the caller owns the `<dl>`). */
export function JobPeopleFacts({ job }: { job: JobRecord }) {
  return (
    <>
      <div>
        <dt className="text-sm font-semibold text-muted">Salesperson</dt>
        <dd>{job.salesperson?.name ?? '—'}</dd>
      </div>
      <div>
        <dt className="text-sm font-semibold text-muted">Installer</dt>
        <dd>{job.assignedInstaller?.name ?? 'Not assigned yet'}</dd>
      </div>
    </>
  );
}
