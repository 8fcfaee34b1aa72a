import type { JobStatus } from '@contract';

/** Our words for job statuses, shared by the jobs and walk-through features (the records are the contract's). */
export const jobStatusLabels: Record<JobStatus, string> = {
  walkthrough: 'Walk-through',
  design: 'Design',
  proposed: 'Proposed',
  won: 'Won',
  lost: 'Lost',
  installed: 'Installed',
};

/** The words on each status-move button (which moves a person may make is the contract's JOB_STATUS_MACHINE). */
export const moveLabels: Record<JobStatus, string> = {
  walkthrough: 'Back to walk-through',
  design: 'Move to design',
  proposed: 'Mark proposed',
  won: 'Mark won',
  lost: 'Mark lost',
  installed: 'Mark installed',
};

/** The status as words, with why a lost job was lost (the job page and the jobs list show the same). */
export function jobStatusText(job: { readonly status: JobStatus; readonly lostReason?: string | null }): string {
  const label = jobStatusLabels[job.status];
  return job.status === 'lost' && job.lostReason ? `${label}: ${job.lostReason}` : label;
}
