import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { ApiError } from '../../../lib/api-error';
import { jobKeys } from '../../../entities/job/query-keys';
import { jobResponse } from '@contract';
import type { NewJobValues } from '../schemas';
import { createCustomer, sameCustomerOf } from './create-customer';

export interface CreateJobBody {
  customerId: string;
  street: string;
  unit?: string;
  city: string;
  region: string;
  postalCode: string;
  notes?: string;
}

/** POST /api/jobs — the server prefills the design conditions from the company defaults. */
export async function createJob(body: CreateJobBody) {
  return (await apiFetch('/api/jobs', { method: 'POST', body, schema: jobResponse })).job;
}

/** Customer field errors come back under "name"/"email"/"phone"; the form calls them customerX. */
const customerField: Record<string, string> = { name: 'customerName', email: 'customerEmail', phone: 'customerPhone' };

/**
 * Makes the customer (unless picked, or made by an earlier try that then failed on the
 * job), then the job. `onCustomer` keeps the new id so a retry does not make a second one.
 */
async function createCustomerAndJob({
  values: v,
  madeCustomerId,
  onCustomer,
  createAnyway = false,
}: {
  values: NewJobValues;
  madeCustomerId: string | null;
  onCustomer: (id: string) => void;
  /** The person answered "No, a new customer" to "Use the existing customer?". */
  createAnyway?: boolean;
}) {
  let customerId = v.customerMode === 'existing' ? v.customerId : (madeCustomerId ?? '');
  if (v.customerMode === 'new' && !madeCustomerId) {
    try {
      customerId = (
        await createCustomer({
          name: v.customerName,
          email: v.customerEmail || null,
          phone: v.customerPhone || null,
          ...(createAnyway ? { createAnyway: true } : {}),
        })
      ).id;
      onCustomer(customerId);
    } catch (e) {
      if (!(e instanceof ApiError) || sameCustomerOf(e)) throw e;
      throw new ApiError({ ...e, errors: e.errors.map((f) => ({ ...f, path: customerField[f.path] ?? f.path })) });
    }
  }
  return createJob({
    customerId,
    street: v.street,
    unit: v.unit,
    city: v.city,
    region: v.region,
    postalCode: v.postalCode,
    notes: v.notes,
  });
}

export function useCreateJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCustomerAndJob,
    onSuccess: async (job) => {
      queryClient.setQueryData(jobKeys.detail(job.id), job);
      await queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
    },
  });
}
