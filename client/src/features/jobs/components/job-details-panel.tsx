import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { z } from 'zod';
import {
  blankOr,
  customerRules,
  INSTALLER_ROLES,
  isOfficeRole,
  JOB_OWNER_ROLES,
  mayDeleteJob,
  mayEditJob,
  roleIn,
  siteRules,
  type Role,
  type StaffMember,
  type CustomerRecord,
  type JobRecord,
} from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { SelectField, SubmitButton, TextField } from '../../../components/ui/form-fields';
import { Spinner } from '../../../components/ui/spinner';
import { useJobEdits } from '../../../entities/job/job-edits';
import { JobPeopleFacts } from '../../../entities/job/job-people';
import { jobStatusText } from '../../../entities/job/labels';
import { customerQueryOptions, staffQueryOptions } from '../../../entities/job/queries';
import type { CustomerChanges, JobChanges } from '../../../entities/job/requests';
import { errorMessage } from '../../../lib/api-error';
import { useViewer } from '../../../lib/viewer';
import { useSaveJobDetails } from '../api/save-job-details';
import { DeleteJobButton } from './delete-job-button';
import { SiteFields } from './site-fields';
import { StatusMoves } from './status-moves';

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

/** The site fields as the form holds them. */
const siteOf = (job: JobRecord) => ({
  street: job.site.street,
  unit: job.site.unit,
  city: job.site.city,
  region: job.site.region,
  postalCode: job.site.postalCode,
  notes: job.notes,
});

function valuesOf(job: JobRecord, customer: CustomerRecord): DetailsInput {
  return {
    customerName: customer.name,
    customerEmail: customer.email ?? '',
    customerPhone: customer.phone ?? '',
    ...siteOf(job),
    salespersonId: job.salesperson?.id ?? '',
    assignedInstallerId: job.assignedInstaller?.id ?? '',
  };
}

/**
 * Only fields the person touched (`dirty`) and that differ from the job as held now go out, so
 * a field someone else changed meanwhile is never sent back with the value this form opened with.
 */
function jobChanges(job: JobRecord, v: DetailsValues, office: boolean, dirty: ReadonlySet<string>): JobChanges {
  const out: Record<string, string | null> = {};
  const site = siteOf(job);
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

function customerChanges(c: CustomerRecord, v: DetailsValues, dirty: ReadonlySet<string>): CustomerChanges {
  const out: { name?: string; email?: string | null; phone?: string | null } = {};
  if (dirty.has('customerName') && v.customerName !== c.name) out.name = v.customerName;
  if (dirty.has('customerEmail') && (v.customerEmail || null) !== c.email) out.email = v.customerEmail || null;
  if (dirty.has('customerPhone') && (v.customerPhone || null) !== c.phone) out.phone = v.customerPhone || null;
  return out;
}

const peopleOptions = (
  staff: readonly StaffMember[],
  roles: readonly Role[],
  current: { id: string; name: string } | null,
) => {
  const list = staff.filter((s) => roleIn(roles, s.role)).map((s) => ({ value: s.id, label: s.name }));
  // Someone no longer active still shows as the one the job is with until it is handed on.
  if (current && !list.some((o) => o.value === current.id))
    list.unshift({ value: current.id, label: `${current.name} (inactive)` });
  return list;
};

function DetailsForm({ job, customer, office }: { job: JobRecord; customer: CustomerRecord; office: boolean }) {
  const save = useSaveJobDetails();
  const staff = useQuery({ ...staffQueryOptions(), enabled: office });
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
        const landed = await save.mutateAsync({
          job,
          customer,
          forJob: jobChanges(job, values, office, dirty),
          forCustomer: customerChanges(customer, values, dirty),
        });
        form.reset(values);
        setSaved(landed);
      }}
    >
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-base font-semibold text-ink-900">Customer</legend>
        <TextField name="customerName" label="Customer name" autoComplete="off" />
        <TextField name="customerEmail" label="Customer e-mail" type="email" inputMode="email" autoComplete="off" />
        <TextField name="customerPhone" label="Customer phone" type="tel" inputMode="tel" autoComplete="off" />
      </fieldset>
      <SiteFields legendClass="mb-2 text-base font-semibold text-ink-900" />
      {office ? (
        staff.data ? (
          <fieldset className="grid gap-4 sm:grid-cols-2">
            <legend className="mb-2 text-base font-semibold text-ink-900">People</legend>
            <SelectField
              name="salespersonId"
              label="Salesperson"
              options={peopleOptions(staff.data, JOB_OWNER_ROLES, job.salesperson)}
            />
            <SelectField
              name="assignedInstallerId"
              label="Installer"
              options={[
                { value: '', label: 'Not assigned yet' },
                ...peopleOptions(staff.data, INSTALLER_ROLES, job.assignedInstaller),
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
 * The job itself, folded away under the walk-through (app/routes/job-walkthrough.tsx puts it there): where it stands (with the moves the
 * person may make), the customer's contact details, the site, who it is with, and delete.
 * Installers see it read-only, as the server lets them.
 */
export function JobDetailsPanel({ job }: { job: JobRecord }) {
  const viewer = useViewer();
  const canEdit = viewer !== null && mayEditJob(viewer.role);
  const customer = useQuery({ ...customerQueryOptions(job.customer.id), enabled: canEdit });
  const edits = useJobEdits();
  // The people to choose from are asked for now, as the customer is, so the form has them when it opens.
  useQuery({ ...staffQueryOptions(), enabled: canEdit && viewer !== null && isOfficeRole(viewer.role) });
  // The form is made when the fold is first opened: folded, it is only its line, so the walk-through's
  // first seconds on a phone do not pay for a form nobody has opened yet (issue 11). Once made it stays.
  const [opened, setOpened] = useState(false);
  return (
    <details
      className="rounded-lg border border-line bg-white p-4"
      onToggle={(e) => {
        if (e.currentTarget.open) setOpened(true);
      }}
    >
      <summary className="min-h-touch cursor-pointer text-lg font-semibold text-ink-900">
        Job details{' '}
        <span className="ml-2 rounded-full bg-ink-50 px-3 py-1 text-sm font-semibold text-ink-800">
          {jobStatusText(job)}
        </span>
      </summary>
      {opened ? (
        <div className="mt-4 flex flex-col gap-6">
          {canEdit ? <StatusMoves job={job} viewer={viewer} /> : null}
          {!canEdit ? (
            <ReadOnlyPeople job={job} />
          ) : customer.data ? (
            <DetailsForm
              job={job}
              customer={edits.overlayCustomer(customer.data)}
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
      ) : null}
    </details>
  );
}
