import { customerResponse, jobResponse, type JobStatus } from '@contract';
import { apiFetch } from '../../lib/api-client';
import { isApiError } from '../../lib/api-error';
import { customerPath, jobPath } from './paths';

/**
 * The writes of the job records, as plain requests. Screens call them through their feature's
 * `useMutation` hooks or the walk-through's queue (which replays them with `person`).
 */

/** What a PATCH of the job may change: the walk-through's design edits and the job details. */
export interface JobChanges {
  readonly designConditions?: Record<string, number | string>;
  readonly designSourceNotes?: Record<string, string>;
  readonly tightness?: string;
  /** Whole-house facts, sent whole (bedrooms, blower door, ventilation). */
  readonly house?: Record<string, unknown>;
  /** Job details (the site, notes, who it is with): only the fields the person changed. */
  readonly street?: string;
  readonly unit?: string;
  readonly city?: string;
  readonly region?: string;
  readonly postalCode?: string;
  readonly notes?: string;
  readonly salespersonId?: string;
  readonly assignedInstallerId?: string | null;
  readonly status?: JobStatus;
  /** With status "lost": one of the company's loss reasons. */
  readonly lostReason?: string;
}

/** The job-details fields of JobChanges (the rest are the walk-through's design edits and the status). */
export const DETAIL_FIELDS = [
  'street',
  'unit',
  'city',
  'region',
  'postalCode',
  'notes',
  'salespersonId',
  'assignedInstallerId',
] as const;

/** The customer's contact details as the job details form changes them. */
export interface CustomerChanges {
  readonly name?: string;
  readonly email?: string | null;
  readonly phone?: string | null;
}

/** PATCH /api/jobs/:jobId, If-Match: the version the person edited. */
export async function updateJob(jobId: string, version: number | null, changes: JobChanges, person?: string) {
  return (await apiFetch(jobPath(jobId), { method: 'PATCH', version, body: changes, person, schema: jobResponse })).job;
}

/** PATCH /api/customers/:id, If-Match: the version the person edited. */
export async function saveCustomer(
  customerId: string,
  version: number | null,
  changes: CustomerChanges,
  person?: string,
) {
  return (
    await apiFetch(customerPath(customerId), {
      method: 'PATCH',
      version,
      body: changes,
      person,
      schema: customerResponse,
    })
  ).customer;
}

/** DELETE /api/jobs/:jobId, If-Match: the version the person saw. Rooms and photos go with it. */
export async function deleteJob(jobId: string, version: number) {
  await apiFetch(jobPath(jobId), { method: 'DELETE', version }).catch((e: unknown) => {
    // Deleted already (on another device, or an answer lost on the way): what was asked is done.
    if (!(isApiError(e) && e.status === 404)) throw e;
  });
}
