import { apiFetch } from '../../../lib/api-client';
import { jobPath } from '../../../lib/job-queries';
import { jobResponse } from '@contract';
import type { JobChanges } from '../sync/edits';

/** PATCH /api/jobs/:jobId, If-Match: the version the person edited. */
export async function updateJob(jobId: string, version: number | null, changes: JobChanges, person?: string) {
  return (await apiFetch(jobPath(jobId), { method: 'PATCH', version, body: changes, person, schema: jobResponse })).job;
}
