import { useQueryClient } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import { z } from 'zod';
import {
  blankOr,
  customerRules,
  isOfficeRole,
  mayDeleteJob,
  mayEditJob,
  movesFor,
  NO_PROPOSAL_YET,
  siteRules,
  type JobStatus,
  type StaffMember,
  type CustomerRecord,
  type JobRecord,
} from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Form } from '../../../components/ui/form';
import { SelectField, SubmitButton, TextField } from '../../../components/ui/form-fields';
import { Spinner } from '../../../components/ui/spinner';
import { ApiError, errorMessage, isApiError } from '../../../lib/api-error';
import { jobKeys } from '../../../lib/job-queries';
import { jobStatusLabels, moveLabels } from '../../../lib/job-labels';
import { useViewer, type Viewer } from '../../../lib/viewer';
import {
  customerQueryOptions,
  saveJobDetails,
  useCustomer,
  useStaff,
  type JobDetailsChanges,
} from '../api/job-details';
import { customerTarget, DETAIL_FIELDS, jobTarget, type WalkthroughEdit } from '../sync/edits';
import { overlayCustomer } from '../sync/overlay';
import { useQueueState, useWalkthroughQueue } from '../sync/queue-context';
import { DeleteJobButton } from './delete-job-button';
import { JobPeopleFacts } from './job-people';

const detailsSchema = z.object({
  customerName: customerRules.name,
  customerEmail: blankOr(customerRules.email),
  customerPhone: blankOr(customerRules.phone),
  ...siteRules,
  salespersonId: z.string(),
  assignedInstallerId: z.string(),
});
type DetailsInput = z.input<typeof detailsSchema>;
type DetailsValues = z.output<typeof detailsSchema>;

function valuesOf(job: JobRecord, customer: CustomerRecord): DetailsInput {
  return {
    customerName: customer.name,
    customerEmail: customer.email ?? '',
    customerPhone: customer.phone ?? '',
    street: job.site.street,
    unit: job.site.unit,
    city: job.site.city,
    region: job.site.region,
    postalCode: job.site.postalCode,
    notes: job.notes,
    salespersonId: job.salesperson?.id ?? '',
    assignedInstallerId: job.assignedInstaller?.id ?? '',
  };
}

/**
 * Only fields the person touched (`dirty`) and that differ from the job as held now go out, so
 * a field someone else changed meanwhile is never sent back with the value this form opened with.
 */
function jobChanges(job: JobRecord, v: DetailsValues, office: boolean, dirty: ReadonlySet<string>): JobDetailsChanges {
  const out: Record<string, string | null> = {};
  const site = {
    street: job.site.street,
    unit: job.site.unit,
    city: job.site.city,
    region: job.site.region,
    postalCode: job.site.postalCode,
    notes: job.notes,
  };
  for (const [k, before] of Object.entries(site)) {
    const now = v[k as keyof typeof site];
    if (dirty.has(k) && now !== before) out[k] = now;
  }
  if (office && dirty.has('salespersonId') && v.salespersonId && v.salespersonId !== (job.salesperson?.id ?? ''))
    out.salespersonId = v.salespersonId;
  if (office && dirty.has('assignedInstallerId') && v.assignedInstallerId !== (job.assignedInstaller?.id ?? ''))
    out.assignedInstallerId = v.assignedInstallerId || null;
  return out;
}

function customerChanges(c: CustomerRecord, v: DetailsValues, dirty: ReadonlySet<string>) {
  const out: { name?: string; email?: string | null; phone?: string | null } = {};
  if (dirty.has('customerName') && v.customerName !== c.name) out.name = v.customerName;
  if (dirty.has('customerEmail') && (v.customerEmail || null) !== c.email) out.email = v.customerEmail || null;
  if (dirty.has('customerPhone') && (v.customerPhone || null) !== c.phone) out.phone = v.customerPhone || null;
  return out;
}

/** A job-details or customer edit (not a design-conditions one) of the walk-through queue. */
function isDetailsEdit(e: WalkthroughEdit): boolean {
  if (e.kind === 'customer-update') return true;
  return e.kind === 'job-update' && DETAIL_FIELDS.some((k) => e.changes[k] !== undefined);
}

/**
 * Writes that change the job straight away must not overtake a design-conditions edit still in
 * the walk-through queue (it would then meet a newer version): wait for the queue, then use the
 * newest version this tab holds.
 */
function useJobWriter(job: JobRecord) {
  const queue = useWalkthroughQueue();
  const queryClient = useQueryClient();
  const latest = useRef(job);
  latest.current = job;
  return async (changes: JobDetailsChanges) => {
    await queue.flush();
    const held = queryClient.getQueryData<JobRecord>(jobKeys.detail(job.id)) ?? latest.current;
    try {
      const saved = await saveJobDetails(job.id, held.version, changes);
      queryClient.setQueryData(jobKeys.detail(job.id), saved);
      void queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
      return saved;
    } catch (e) {
      if (isApiError(e) && e.status === 409) {
        // Show their version; what this person typed stays in the form to save again.
        await queryClient.invalidateQueries({ queryKey: jobKeys.detail(job.id), exact: true });
        throw new ApiError({
          ...e,
          detail:
            'Someone else saved this job meanwhile. Their version is loaded now: check the fields and save again.',
          errors: [],
        });
      }
      throw e;
    }
  };
}

function StatusMoves({ job, viewer }: { job: JobRecord; viewer: Viewer }) {
  const write = useJobWriter(job);
  const [busy, setBusy] = useState<JobStatus | null>(null);
  const [error, setError] = useState<string | null>(null);
  const moves = movesFor(viewer.role, job.status, NO_PROPOSAL_YET);
  if (moves.length === 0) return null;
  const move = async (to: JobStatus) => {
    setBusy(to);
    setError(null);
    try {
      await write({ status: to });
    } catch (e) {
      setError(errorMessage(e));
    } finally {
      setBusy(null);
    }
  };
  return (
    <div role="group" aria-labelledby={`moves-${job.id}`} className="flex flex-col gap-2">
      <p id={`moves-${job.id}`} className="text-base font-semibold text-ink-900">
        Status: {jobStatusLabels[job.status]}
      </p>
      <div className="flex flex-wrap gap-2">
        {moves.map((to) => (
          <Button
            key={to}
            variant={to === 'lost' ? 'ghost' : 'secondary'}
            busy={busy === to}
            disabled={busy !== null}
            onClick={() => void move(to)}
          >
            {moveLabels[to]}
          </Button>
        ))}
      </div>
      {error ? (
        <Alert tone="danger" title="The status was not changed.">
          {error}
        </Alert>
      ) : null}
    </div>
  );
}

const peopleOptions = (
  staff: readonly StaffMember[],
  roles: readonly string[],
  current: { id: string; name: string } | null,
) => {
  const list = staff.filter((s) => roles.includes(s.role)).map((s) => ({ value: s.id, label: s.name }));
  // Someone no longer active still shows as the one the job is with until it is handed on.
  if (current && !list.some((o) => o.value === current.id))
    list.unshift({ value: current.id, label: `${current.name} (inactive)` });
  return list;
};

const CONFLICT_DETAIL =
  'Someone else saved this job meanwhile. Their version is loaded now: check the fields and save again.';
const CUSTOMER_CONFLICT_DETAIL =
  'Someone else saved this customer meanwhile. Their version is loaded now: check the fields and save again.';

function DetailsForm({ job, customer, office }: { job: JobRecord; customer: CustomerRecord; office: boolean }) {
  const queryClient = useQueryClient();
  const queue = useWalkthroughQueue();
  const staff = useStaff(office);
  const [saved, setSaved] = useState<'server' | 'device' | null>(null);
  return (
    <Form
      schema={detailsSchema}
      defaultValues={valuesOf(job, customer)}
      aria-label="Job details"
      onSubmit={async (values, form) => {
        setSaved(null);
        // Only fields the person touched go out (see jobChanges).
        const dirty = new Set(
          Object.entries(form.formState.dirtyFields)
            .filter(([, on]) => on === true)
            .map(([k]) => k),
        );
        // Through the walk-through's queue, like every other edit: stored on the device first, so
        // details typed with no signal survive a reload and go out, in order, when it is back.
        const forCustomer = customerChanges(customer, values, dirty);
        const forJob = jobChanges(job, values, office, dirty);
        const customerKey = customerQueryOptions(customer.id).queryKey;
        const targets = new Set<string>();
        if (Object.keys(forCustomer).length > 0) {
          const held = queryClient.getQueryData<CustomerRecord>(customerKey) ?? customer;
          targets.add(customerTarget(customer.id));
          await queue.enqueue({
            target: customerTarget(customer.id),
            baseVersion: held.version,
            payload: { kind: 'customer-update', jobId: job.id, customerId: customer.id, changes: forCustomer },
          });
        }
        if (Object.keys(forJob).length > 0) {
          const held = queryClient.getQueryData<JobRecord>(jobKeys.detail(job.id)) ?? job;
          targets.add(jobTarget(job.id));
          await queue.enqueue({
            target: jobTarget(job.id),
            baseVersion: held.version,
            payload: { kind: 'job-update', jobId: job.id, changes: forJob },
          });
        }
        await queue.flush();
        const state = queue.getSnapshot();
        const conflict = state.conflict;
        if (conflict && targets.has(conflict.target) && isDetailsEdit(conflict.payload)) {
          // Show their version; what this person typed stays in the form to save again.
          await queue.resolveConflict(conflict.id, 'drop');
          const isCustomer = conflict.payload.kind === 'customer-update';
          await queryClient.invalidateQueries({
            queryKey: isCustomer ? customerKey : jobKeys.detail(job.id),
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
        form.reset(values);
        setSaved(state.items.some((i) => targets.has(i.target)) ? 'device' : 'server');
      }}
    >
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-base font-semibold text-ink-900">Customer</legend>
        <TextField name="customerName" label="Customer name" autoComplete="off" />
        <TextField name="customerEmail" label="Customer e-mail" type="email" inputMode="email" autoComplete="off" />
        <TextField name="customerPhone" label="Customer phone" type="tel" inputMode="tel" autoComplete="off" />
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-base font-semibold text-ink-900">Site</legend>
        <TextField name="street" label="Street address" autoComplete="off" />
        <TextField name="unit" label="Unit or apartment" autoComplete="off" />
        <TextField name="city" label="City or town" autoComplete="off" />
        <TextField name="region" label="State or region" autoComplete="off" />
        <TextField name="postalCode" label="Postal code" autoComplete="off" />
        <TextField name="notes" label="Job notes" autoComplete="off" />
      </fieldset>
      {office ? (
        staff.data ? (
          <fieldset className="grid gap-4 sm:grid-cols-2">
            <legend className="mb-2 text-base font-semibold text-ink-900">People</legend>
            <SelectField
              name="salespersonId"
              label="Salesperson"
              options={peopleOptions(staff.data, ['salesperson', 'estimator', 'owner'], job.salesperson)}
            />
            <SelectField
              name="assignedInstallerId"
              label="Installer"
              options={[
                { value: '', label: 'Not assigned yet' },
                ...peopleOptions(staff.data, ['installer'], job.assignedInstaller),
              ]}
            />
          </fieldset>
        ) : staff.isError ? (
          <Alert tone="warning" title="Could not load your company’s people.">
            {errorMessage(staff.error)}
          </Alert>
        ) : (
          <Spinner label="Loading your company’s people…" />
        )
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        <SubmitButton>Save details</SubmitButton>
        {saved === 'server' ? (
          <p role="status" className="text-sm font-semibold text-ok">
            Details saved.
          </p>
        ) : saved === 'device' ? (
          <p role="status" className="text-sm font-semibold text-amber-deep">
            Details kept on this device; they are sent when the connection is back.
          </p>
        ) : null}
      </div>
    </Form>
  );
}

function ReadOnlyPeople({ job }: { job: JobRecord }) {
  return (
    <dl className="grid gap-2 text-base sm:grid-cols-2">
      <JobPeopleFacts job={job} />
    </dl>
  );
}

/**
 * The job itself, folded away under the walk-through: where it stands (with the moves the
 * person may make), the customer's contact details, the site, who it is with, and delete.
 * Installers see it read-only, as the server lets them.
 */
export function JobDetailsPanel({ job }: { job: JobRecord }) {
  const viewer = useViewer();
  const canEdit = viewer !== null && mayEditJob(viewer.role);
  const customer = useCustomer(job.customer.id, canEdit);
  const waiting = useQueueState().items;
  return (
    <details className="rounded-lg border border-line bg-white p-4">
      <summary className="min-h-touch cursor-pointer text-lg font-semibold text-ink-900">
        Job details{' '}
        <span className="ml-2 rounded-full bg-ink-50 px-3 py-1 text-sm font-semibold text-ink-800">
          {jobStatusLabels[job.status]}
        </span>
      </summary>
      <div className="mt-4 flex flex-col gap-6">
        {canEdit ? <StatusMoves job={job} viewer={viewer} /> : null}
        {!canEdit ? (
          <ReadOnlyPeople job={job} />
        ) : customer.data ? (
          <DetailsForm
            job={job}
            customer={overlayCustomer(customer.data, waiting)}
            office={viewer !== null && isOfficeRole(viewer.role)}
          />
        ) : customer.isError ? (
          <Alert tone="danger" title="Could not load the customer’s details.">
            {errorMessage(customer.error)}
          </Alert>
        ) : (
          <Spinner label="Loading the customer’s details…" />
        )}
        {/* Kept apart from Save, so a thumb on a phone does not find it by accident. */}
        {viewer && mayDeleteJob(viewer, job) ? (
          <div className="border-t border-line pt-4">
            <DeleteJobButton job={job} />
          </div>
        ) : null}
      </div>
    </details>
  );
}
