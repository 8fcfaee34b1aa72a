import type { JobStatus } from '@contract';

/** Where the desk's mark still means something: before a sale is decided (a proposed job may carry a revision). */
const MARK_SHOWS_IN: ReadonlySet<JobStatus> = new Set(['walkthrough', 'design', 'proposed']);

/** Whether a job in the list shows the desk's "ready to propose" mark: never once it is won, lost or installed. */
export const showsReadyMark = (job: { readyToProposeAt?: string | null; status: JobStatus }): boolean =>
  Boolean(job.readyToProposeAt) && MARK_SHOWS_IN.has(job.status);

/**
 * The desk's "ready to propose" mark on a job in the list: a tick and the words, on a soft green pill,
 * so it reads without colour. Nothing when the job is not marked, or when the sale is already decided (won,
 * lost or installed: the mark stays on the job for a revision, but "Ready to propose" beside "Won" misleads).
 */
export function ReadyBadge({ job }: { job: { readyToProposeAt?: string | null; status: JobStatus } }) {
  if (!showsReadyMark(job)) return null;
  return (
    <span className="inline-flex w-fit items-center gap-1 whitespace-nowrap rounded-full border border-ok bg-ok-soft px-2 py-0.5 text-sm font-semibold text-ok">
      <span aria-hidden="true">✓</span>
      Ready to propose
    </span>
  );
}
