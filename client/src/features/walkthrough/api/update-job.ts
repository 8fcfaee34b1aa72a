import { jobPath } from '../../../lib/job-queries';
import { jobResponse } from '../../../lib/job-records';
import { versionedFetch } from '../../../lib/versioned-request';
import type { JobChanges } from '../sync/edits';

/** PATCH /api/jobs/:jobId, If-Match: the version the person edited. */
export async function updateJob(jobId: string, version: number | null, changes: JobChanges) {
  return (await versionedFetch(jobPath(jobId), { method: 'PATCH', version, body: changes, schema: jobResponse })).job;
}
