import { queryOptions } from '@tanstack/react-query';
import {
  commissioningResponse,
  type CommissioningPatch,
  type CommissioningRecord,
  type RefrigerantEntryInput,
} from '@contract';
import { z } from 'zod';
import { jobPath } from '../../../entities/job/paths';
import { apiFetch } from '../../../lib/api-client';

export const recordPath = (jobId: string) => `${jobPath(jobId)}/commissioning`;

export const commissioningKeys = {
  record: (jobId: string) => ['commissioning', jobId] as const,
};

/** GET the record (made empty on the server at the first read); kept on the phone by the query persister. */
export const recordQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: commissioningKeys.record(jobId),
    queryFn: async ({ signal }) =>
      (await apiFetch(recordPath(jobId), { schema: commissioningResponse, signal })).record,
    staleTime: 30_000,
  });

export async function patchRecord(
  jobId: string,
  version: number | null,
  patch: CommissioningPatch,
  person?: string,
): Promise<CommissioningRecord> {
  const out = await apiFetch(recordPath(jobId), {
    method: 'PATCH',
    body: patch,
    version,
    schema: commissioningResponse,
    ...(person ? { person } : {}),
  });
  return out.record;
}

export async function postRefrigerant(
  jobId: string,
  entry: RefrigerantEntryInput,
  person?: string,
): Promise<CommissioningRecord> {
  const out = await apiFetch(`${recordPath(jobId)}/refrigerant`, {
    method: 'POST',
    body: entry,
    schema: commissioningResponse,
    ...(person ? { person } : {}),
  });
  return out.record;
}

export async function signOff(
  jobId: string,
  version: number,
  body: { customerName: string; signature: string },
): Promise<CommissioningRecord> {
  return (
    await apiFetch(`${recordPath(jobId)}/sign-off`, {
      method: 'POST',
      body,
      version,
      schema: commissioningResponse,
    })
  ).record;
}

export async function addAmendment(
  jobId: string,
  body: { what: string; correction: string; reason: string },
): Promise<CommissioningRecord> {
  return (await apiFetch(`${recordPath(jobId)}/amendments`, { method: 'POST', body, schema: commissioningResponse }))
    .record;
}

const certResponse = z.object({ certNumber: z.string().nullable() });
export async function saveCertNumber(certNumber: string): Promise<string | null> {
  return (
    await apiFetch('/api/me/refrigerant-certification', {
      method: 'PUT',
      body: { certNumber },
      schema: certResponse,
    })
  ).certNumber;
}
