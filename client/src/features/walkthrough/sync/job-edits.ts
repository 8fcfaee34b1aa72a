import { useQueryClient } from '@tanstack/react-query';
import type { CustomerRecord, JobRecord } from '@contract';
import type { JobEdits } from '../../../entities/job/job-edits';
import { jobKeys } from '../../../entities/job/query-keys';
import { DETAIL_FIELDS } from '../../../entities/job/requests';
import { ApiError } from '../../../lib/api-error';
import { customerTarget, jobTarget, type WalkthroughEdit } from './edits';
import { overlayCustomer } from './overlay';
import { usePhotoQueue } from './photo-queue-context';
import { useQueueState, useWalkthroughQueue } from './queue-context';

const CONFLICT_DETAIL =
  'Someone else saved this job meanwhile. Their version is loaded now: check the fields and save again.';
const CUSTOMER_CONFLICT_DETAIL =
  'Someone else saved this customer meanwhile. Their version is loaded now: check the fields and save again.';

/** A job-details or customer edit (not a design-conditions one) of the walk-through queue. */
function isDetailsEdit(e: WalkthroughEdit): boolean {
  if (e.kind === 'customer-update') return true;
  return e.kind === 'job-update' && DETAIL_FIELDS.some((k) => e.changes[k] !== undefined);
}

/**
 * The job screens' port (entities/job/job-edits.tsx) onto the walk-through's queue: job details and
 * customer edits go through it like every other edit — stored on the device first, so details typed
 * with no signal survive a reload and go out, in order, when it is back.
 */
export function useWalkthroughJobEdits(): JobEdits {
  const queue = useWalkthroughQueue();
  const photos = usePhotoQueue();
  const waiting = useQueueState().items;
  const queryClient = useQueryClient();
  return {
    flush: () => queue.flush(),
    discardJob: async (jobId) => {
      await Promise.all([queue.discard((i) => i.payload.jobId === jobId), photos.discardJob(jobId)]);
    },
    overlayCustomer: (customer) => overlayCustomer(customer, waiting),
    saveDetails: async ({ job, customer, forJob, forCustomer }) => {
      const targets = new Set<string>();
      const put = async (target: string, version: number, payload: WalkthroughEdit) => {
        targets.add(target);
        await queue.enqueue({ target, baseVersion: version, payload });
      };
      if (Object.keys(forCustomer).length > 0) {
        const held = queryClient.getQueryData<CustomerRecord>(jobKeys.customer(customer.id)) ?? customer;
        const payload = {
          kind: 'customer-update',
          jobId: job.id,
          customerId: customer.id,
          changes: forCustomer,
        } as const;
        await put(customerTarget(customer.id), held.version, payload);
      }
      if (Object.keys(forJob).length > 0) {
        const held = queryClient.getQueryData<JobRecord>(jobKeys.detail(job.id)) ?? job;
        await put(jobTarget(job.id), held.version, { kind: 'job-update', jobId: job.id, changes: forJob });
      }
      await queue.flush();
      const state = queue.getSnapshot();
      const conflict = state.conflict;
      if (conflict && targets.has(conflict.target) && isDetailsEdit(conflict.payload)) {
        // Show their version; what this person typed stays in the form to save again.
        await queue.resolveConflict(conflict.id, 'drop');
        const isCustomer = conflict.payload.kind === 'customer-update';
        await queryClient.invalidateQueries({
          queryKey: isCustomer ? jobKeys.customer(customer.id) : jobKeys.detail(job.id),
          exact: true,
        });
        throw new ApiError({
          status: 409,
          code: 'conflict',
          title: 'Conflict',
          detail: isCustomer ? CUSTOMER_CONFLICT_DETAIL : CONFLICT_DETAIL,
        });
      }
      if (state.rejected && !state.items.some((i) => targets.has(i.target))) {
        const message = state.rejected;
        queue.dismissRejected();
        throw new ApiError({ status: 400, code: 'validation', title: 'Not saved', detail: message });
      }
      return state.items.some((i) => targets.has(i.target)) ? 'device' : 'server';
    },
  };
}
